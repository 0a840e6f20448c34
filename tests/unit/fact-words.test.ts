import { describe, it, expect } from 'vitest'
import { factWords } from '../../app/utils/fact-words'
import { evaluate } from '../../shared/compute'
import { quennel95 } from '../../shared/platforms/quennel-95'
import { schemaProperties } from '../../shared/compute/parameter-input'
import { exampleSpec } from '../../shared/compute/example'
import { defaultParameters } from '../../shared/platforms/index'

describe('the tune sheet names a fact it could not use in words', () => {
  it('a car fact by its field label, a workshop setting by its name, a setting by its title', () => {
    expect(factWords('spec.tyreSizeRear')).toBe('Rear tyre size, if different')
    expect(factWords('spec.kerbMassKg')).toBe('Kerb mass (converted)')
    expect(factWords('settings.friction.wet')).toBe('Wet-road friction')
    expect(factWords('platform.motorMaxRpm')).toBe('The drive unit')
    const titles = schemaProperties(quennel95.schema)
    expect(factWords('parameters.hillHold', titles)).toBe('Hill hold')
    expect(factWords('parameters.turboBoost', titles)).toBe('A setting this drive unit does not have')
  })

  it('every problem a broken car fact raises reads as words, with no dotted path or field name left', () => {
    const result = evaluate({ ...exampleSpec, tyreSizeRear: '999/1 R2', kerbMassKg: -5 }, quennel95, defaultParameters(quennel95), { friction: { wet: 7 } } as never)
    const paths = result.errors.map(e => e.path).filter(p => !p.startsWith('parameters.'))
    expect(paths.length).toBeGreaterThan(0)
    for (const p of paths) expect(factWords(p)).not.toMatch(/\.|[a-z][A-Z]/)
  })
})
