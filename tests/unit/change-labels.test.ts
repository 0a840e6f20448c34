import { describe, it, expect } from 'vitest'
import { changePathLabel } from '../../shared/utils/audit-actions'

// The labels come from the product's own field lists (spec sheet, drive-unit schemas, settings); what is
// checked here is that each kind of record finds its own words, and that anything else is put in words.
describe('history field labels', () => {
  it('names a car\'s, a version\'s and the workshop\'s fields in words', () => {
    expect(changePathLabel('/spec/kerbMassKg', 'vehicle')).toBe('Kerb mass (converted), kg')
    expect(changePathLabel('/status', 'vehicle')).toBe('Stage')
    expect(changePathLabel('/parameters/powerCapKw', 'version')).toBe('Power cap, kW')
    expect(changePathLabel('/rationale', 'version')).toBe('Rationale')
    expect(changePathLabel('/friction/snow', 'workshop')).toBe('Snow friction')
    expect(changePathLabel('/units/speed', 'workshop')).toBe('Speed shown as')
    expect(changePathLabel('/status', 'snag')).toBe('Status')
  })

  it('puts the path in words where a record has no words for it, or the kind of record is not known', () => {
    expect(changePathLabel('/status', 'road-test')).toBe('Status')
    expect(changePathLabel('/spec/newThing', 'vehicle')).toBe('Spec › new thing')
    expect(changePathLabel('/spec/peakMotorC', 'vehicle')).toBe('Spec › peak motor, °C')
    expect(changePathLabel('/a~1b/c~0d')).toBe('A/b › c~d') // RFC 6901 escapes
    expect(changePathLabel('')).toBe('(whole record)')
  })
})

describe('settings of the drive units with their own settings', () => {
  it('names a curve\'s point and shows points, not raw data', async () => {
    const { knownChangeLabel } = await import('../../shared/utils/change-labels')
    const { valueText } = await import('../../shared/utils/audit-values')
    expect(knownChangeLabel('version', '/parameters/throttleMap/2/y')).toBe('Throttle map, point 3, torque')
    expect(knownChangeLabel('version', '/parameters/hillHold')).toBe('Hill hold')
    expect(knownChangeLabel('version', '/parameters/powerCapHp')).toBe('Power cap, hp')
    expect(valueText([{ x: 0, y: 0 }, { x: 100, y: 90 }])).toBe('0 → 0, 100 → 90')
  })
})
