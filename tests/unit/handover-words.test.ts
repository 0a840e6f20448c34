import { describe, it, expect } from 'vitest'
import { figureLines, settingLines } from '../../server/utils/handover/words'
import { driftNotice, handoverCautions } from '../../shared/schemas/handover'
import { fenlow45 } from '../../shared/platforms/fenlow-45'
import { quennel95 } from '../../shared/platforms/quennel-95'
import { ROLES, roleSettings } from '../../shared/compute'

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

  it('lists the settings the physics knows in the role list\'s order, then the rest by label, whatever order the schema is stored in', () => {
    // PostgreSQL's jsonb keeps keys shortest first; reversed here so the stored order cannot happen to be right.
    const scrambled = { ...quennel95.schema, properties: Object.fromEntries(Object.entries(quennel95.schema.properties).reverse()) }
    const values = Object.fromEntries(Object.entries(quennel95.schema.properties).map(([k, p]) => [k, (p as { default: unknown }).default]))
    const labels = settingLines(scrambled, values).map(l => l.label)
    const byRole = roleSettings(quennel95.schema)
    const titleOf = (name: string) => (quennel95.schema.properties as Record<string, { title: string }>)[name]!.title
    const roleTitles = Object.keys(ROLES).filter(r => byRole[r as keyof typeof byRole]).map(r => titleOf(byRole[r as keyof typeof byRole]!))
    expect(labels).toEqual([...roleTitles, 'Drive mode', 'Hill hold', 'Throttle map'])
    expect(labels.slice(0, 3)).toEqual(['Power cap', 'Torque cap', 'Regen torque limit'])
  })

  it('writes the figures as the tune sheet does: decelerations with two decimals, a charge in hours and minutes', () => {
    const figures = { zeroTo50S: 5.2, zeroTo100S: null, topSpeedKph: 110, topSpeedLimitedBy: 'speed limit', maxStartGradePct: 32, startGradeLimitedBy: 'torque', liftOffDecelMs2: 0.5, powerRatioToOriginal: 1.2, chargeTime10to80H: 3.888 }
    const lines = figureLines({ figures } as never, { originalEnginePowerKw: 25, chargerPowerKw: 3.6 } as never)
    expect(lines).toContainEqual({ label: 'Lift-off slowing at 50 km/h', value: '0.50 m/s²' })
    expect(lines).toContainEqual({ label: 'Charging from 10 % to 80 %', value: 'about 3 h 53 min on a 3.6 kW charger' })
  })

  it('speaks of the wheels regen brakes on this car', () => {
    const regen = (axle: 'front' | 'rear' | 'all') => handoverCautions(axle).find(c => c.startsWith('Regenerative braking'))!
    expect(regen('front')).toContain('front-driven car it brakes the front wheels')
    expect(regen('front')).not.toContain('rear')
    expect(regen('rear')).toContain('rear-driven car it brakes the rear wheels')
    expect(regen('all')).toContain('all four wheels')
    expect(handoverCautions('front')).toHaveLength(5)
  })

  it('tells the owner of a car whose controller was found drifted not to rely on the sheet until a qualified engineer has checked it', () => {
    const notice = driftNotice('3 Dec 2026')
    expect(notice).toMatch(/^On 3 Dec 2026 the controller was found holding settings other than those on this sheet/)
    expect(notice).toContain('do not rely on this sheet')
    expect(notice).toContain('qualified engineer')
  })
})
