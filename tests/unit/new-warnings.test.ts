import { describe, it, expect } from 'vitest'
import { newWarnings, worstRank } from '../../shared/utils/new-warnings'

describe('warnings a car raises now that it did not raise at sign-off', () => {
  it('finds a rule that did not warn before', () => {
    expect(newWarnings([{ rule: 'stop-lamp', severity: 'caution' }], [{ rule: 'stop-lamp', severity: 'caution' }, { rule: 'hill-start', severity: 'danger' }]))
      .toEqual([{ rule: 'hill-start', severity: 'danger' }])
  })
  it('counts a rule that got worse as new, and one that got milder as not', () => {
    expect(newWarnings([{ rule: 'tyre-load', severity: 'caution' }], [{ rule: 'tyre-load', severity: 'danger' }])).toHaveLength(1)
    expect(newWarnings([{ rule: 'tyre-load', severity: 'danger' }], [{ rule: 'tyre-load', severity: 'caution' }])).toEqual([])
  })
  it('matches each earlier warning once, so a second warning of the same rule is new', () => {
    const snow = { rule: 'regen-grip-snow', severity: 'danger' as const }
    expect(newWarnings([snow], [snow, snow])).toEqual([snow])
  })
  it('ranks the worst new warning', () => {
    expect(worstRank([])).toBe(0)
    expect(worstRank([{ rule: 'a', severity: 'info' }, { rule: 'b', severity: 'danger' }])).toBe(3)
  })
})
