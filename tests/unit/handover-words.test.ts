import { describe, it, expect } from 'vitest'
import { settingLines } from '../../server/utils/handover/words'
import { handoverCautions } from '../../shared/schemas/handover'
import { fenlow45 } from '../../shared/platforms/fenlow-45'

const defaults = Object.fromEntries(Object.entries(fenlow45.schema.properties).map(([k, p]) => [k, (p as { default: number }).default]))

describe('the handover sheet in the owner\'s words', () => {
  it('lists every setting on the car, those without words of their own by the drive unit\'s title and unit', () => {
    const lines = settingLines(fenlow45.schema, { ...defaults, throttleProgression: 35 })
    expect(lines).toContainEqual(expect.objectContaining({ label: 'Throttle progression', value: '35 %' }))
    // Every setting appears once: in the worded lines or by its title.
    const titles = Object.values(fenlow45.schema.properties).map(p => (p as { title: string }).title)
    const labelled = lines.map(l => l.label)
    expect(titles.filter(t => !labelled.includes(t)).every(t => /Power cap|Torque cap|Regen torque limit|Lift-off regen|Brake regen|Creep|Speed limit|Reverse speed limit|derate start|cut-off|discharge limit|charge limit/.test(t))).toBe(true)
  })

  it('speaks of the wheels regen brakes on this car', () => {
    const regen = (axle: 'front' | 'rear' | 'all') => handoverCautions(axle).find(c => c.startsWith('Regenerative braking'))!
    expect(regen('front')).toContain('front-driven car it brakes the front wheels')
    expect(regen('front')).not.toContain('rear')
    expect(regen('rear')).toContain('rear-driven car it brakes the rear wheels')
    expect(regen('all')).toContain('all four wheels')
    expect(handoverCautions('front')).toHaveLength(5)
  })
})
