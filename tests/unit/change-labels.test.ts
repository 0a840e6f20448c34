import { describe, it, expect } from 'vitest'
import { changePathLabel, detailLabel, detailText } from '../../shared/utils/audit-actions'

// The labels come from the product's own field lists (spec sheet, drive-unit schemas, settings); what is
// checked here is that each kind of record finds its own words, and that anything else keeps its path.
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

  it('keeps the path where a record has no words for it, or the kind of record is not known', () => {
    expect(changePathLabel('/status', 'road-test')).toBe('status')
    expect(changePathLabel('/spec/newThing', 'vehicle')).toBe('spec › newThing')
    expect(changePathLabel('/a~1b/c~0d')).toBe('a/b › c~d') // RFC 6901 escapes
    expect(changePathLabel('')).toBe('(whole record)')
  })

  it('reads an event\'s warnings and its changes from the parent as words, not JSON', () => {
    expect(detailLabel('patchFromParent')).toBe('Changed from that version')
    expect(detailText('warnings', [{ rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'stop-lamp', severity: 'caution' }])).toBe('regen-grip-snow (danger), stop-lamp (caution)')
    expect(detailText('patchFromParent', [{ op: 'replace', path: '/powerCapKw', value: 42 }, { op: 'remove', path: '/creepTorqueNm' }])).toBe('powerCapKw → 42, creepTorqueNm removed')
    expect(detailText('warnings', [])).toBe('(empty)')
  })
})

describe('settings of the drive units with their own settings', () => {
  it('names a curve\'s point and shows points, not raw data', async () => {
    const { knownChangeLabel } = await import('../../shared/utils/change-labels')
    const { changeValueText } = await import('../../shared/utils/audit-actions')
    expect(knownChangeLabel('version', '/parameters/throttleMap/2/y')).toBe('Throttle map, point 3, torque')
    expect(knownChangeLabel('version', '/parameters/hillHold')).toBe('Hill hold')
    expect(knownChangeLabel('version', '/parameters/powerCapHp')).toBe('Power cap, hp')
    expect(changeValueText([{ x: 0, y: 0 }, { x: 100, y: 90 }])).toBe('0 → 0, 100 → 90')
  })
})
