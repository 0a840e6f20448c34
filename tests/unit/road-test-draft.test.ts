import { describe, it, expect } from 'vitest'
import { freshRoadTestDraft, keptExtras } from '../../app/composables/useRoadTestDraft'

describe('the workshop\'s own checks in a road test kept on the phone', () => {
  it('a fresh draft holds one empty entry per check the brief asks for', () => {
    expect(freshRoadTestDraft(['hill-start'], ['horn', 'lamps']).extras).toEqual([
      { key: 'horn', verdict: '', value: null, note: '' }, { key: 'lamps', verdict: '', value: null, note: '' }
    ])
  })

  it('a kept draft keeps what was entered, starts a check added since empty, drops one no longer asked, and reads nothing odd', () => {
    const kept = [
      { key: 'lamps', verdict: 'fail', value: null, note: 'Left dip out' },
      { key: 'retired-one', verdict: 'pass', value: 3, note: '' },
      { key: 'volts', verdict: 'pass', value: '13.7', note: 42 }
    ]
    expect(keptExtras(kept, ['horn', 'lamps', 'volts'])).toEqual([
      { key: 'horn', verdict: '', value: null, note: '' },
      { key: 'lamps', verdict: 'fail', value: null, note: 'Left dip out' },
      { key: 'volts', verdict: 'pass', value: null, note: '' }
    ])
    expect(keptExtras(undefined, ['horn'])).toEqual([{ key: 'horn', verdict: '', value: null, note: '' }])
  })
})
