import { describe, expect, it } from 'vitest'
import { versionEditText } from '../../shared/utils/version-edits'
import { internalNameIn } from './internal-names'

describe('a draft\'s edit in the version\'s review history', () => {
  it('names each setting by its title and writes its value in words, never the field name', () => {
    const text = versionEditText([
      { op: 'test', path: '/parameters/powerCapKw', value: 60 },
      { op: 'replace', path: '/parameters/powerCapKw', value: 80 },
      { op: 'replace', path: '/parameters/liftOffRegenPct', value: 25 },
      { op: 'remove', path: '/parameters/creepTorqueNm' },
      { op: 'replace', path: '/rationale', value: 'Lift-off regen brought down after the wet road test on the roundabout loop.' }
    ])
    expect(text).toBe('Power cap: 80 kW; Lift-off regen: 25 %; Creep torque: removed; Rationale: reworded')
    expect(internalNameIn(text)).toBeUndefined()
  })

  it('says nothing for an event without a patch', () => {
    expect(versionEditText(undefined)).toBe('')
    expect(versionEditText({ not: 'a patch' })).toBe('')
  })
})
