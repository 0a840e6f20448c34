import { describe, it, expect } from 'vitest'
import { decelText, hoursText, powerText, secondUnit, speedText } from '../../app/utils/tune-format'
import { tuneCharts, lineDataset } from '../../app/utils/tune-chart-data'
import { figureRows } from '../../app/utils/tune-figures'
import { groupSettings, parameterGroups } from '../../app/utils/tune-groups'
import { ruleTitles } from '../../app/utils/tune-rules'
import { evaluate, PARAMETER_NAMES, RULE_IDS } from '../../shared/compute'
import { defaultParameters, fenlow45, quennel95 } from '../../shared/platforms'
import { exampleSpec } from '../../shared/compute/example'

describe('tune sheet numbers', () => {
  it('shows hp beside kW and mph beside km/h as the workshop prefers', () => {
    // 1 hp = 745.69987158 W (NIST SP 811, App. B.8): 100 kW = 134.1 hp
    expect(powerText(100)).toBe('100 kW (134 hp)')
    expect(powerText(100, { power: 'kW', speed: 'km/h' })).toBe('100 kW')
    // 1 mph = 1.609344 km/h exactly (NIST SP 811): 160.9344 km/h = 100 mph
    expect(speedText(160.9344, { power: 'kW', speed: 'mph' })).toBe('161 km/h (100 mph)')
    expect(speedText(160.9344)).toBe('161 km/h')
    expect(secondUnit(80, 'kW')).toBe('107 hp') // 80 000 / 745.7 = 107.3
    expect(secondUnit(80, 'km/h', { power: 'kW+hp', speed: 'mph' })).toBe('49.7 mph') // 80 / 1.609344 = 49.71
    expect(secondUnit(80, 'N·m')).toBeNull()
  })

  it('gives deceleration in m/s² and g, and times in hours and minutes, and a dash for what is missing', () => {
    // g = 9.80665 m/s² (3rd CGPM 1901)
    expect(decelText(9.80665)).toBe('9.81\u00a0m/s² (1.00\u00a0g)')
    expect(hoursText(3.5)).toBe('3 h 30 min')
    expect(powerText(null)).toBe('—')
    expect(decelText(Number.NaN)).toBe('—')
  })
})

describe('tune sheet charts', () => {
  const e = evaluate(exampleSpec, fenlow45, defaultParameters(fenlow45))
  const other = evaluate(exampleSpec, fenlow45, { ...defaultParameters(fenlow45), powerCapKw: 20 })

  it('draws the four charts, each from the evaluation\'s curves', () => {
    const charts = tuneCharts(e.curves, undefined)
    expect(charts.map(c => c.id)).toEqual(['force', 'power', 'regen', 'derate'])
    const force = charts[0]!.datasets[0]!
    expect(force.data).toHaveLength(e.curves.speed.speedKph.length)
    expect(force.data[3]).toEqual({ x: e.curves.speed.speedKph[3], y: e.curves.speed.wheelForceN[3] })
    expect(charts[3]!.datasets).toHaveLength(3) // motor, inverter, battery
  })

  it('overlays a compared profile dashed with hollow markers of another shape', () => {
    const charts = tuneCharts(e.curves, other.curves, { current: 'v3', baseline: 'v2' })
    const power = charts[1]!.datasets
    expect(power).toHaveLength(2)
    const [now, then] = power as [typeof power[0], typeof power[0]]
    expect(now.borderDash).toEqual([])
    expect(then.borderDash!.length).toBeGreaterThan(0)
    expect(now.pointStyle).not.toEqual(then.pointStyle)
    expect(then.pointBackgroundColor).toBe('#ffffff')
    expect(now.pointBackgroundColor).toBe(now.borderColor)
    expect(then.label).toContain('v2')
    const peak = (d: typeof now) => Math.max(...d.data.map(p => p.y))
    expect(peak(then)).toBeCloseTo(20 * 0.9, 0) // the 20 kW cap at the wheels, after a 0.9 efficient drivetrain
    expect(peak(now)).toBeGreaterThan(peak(then))
    // Sensors keep their own marker shapes; each compared sensor line is dashed too.
    const derate = charts[3]!.datasets
    expect(derate).toHaveLength(6)
    expect(new Set(derate.slice(0, 3).map(d => d.pointStyle)).size).toBe(3)
    expect(derate.slice(3).every(d => (d.borderDash ?? []).length > 0)).toBe(true)
  })

  it('leaves out points that are not finite rather than drawing them', () => {
    const d = lineDataset({ name: 'x', xs: [0, 1, 2], ys: [1, Number.NaN, 3], colour: '#000', marker: 'circle' }, 'current', {})
    expect(d.data).toEqual([{ x: 0, y: 1 }, { x: 2, y: 3 }])
  })
})

describe('tune sheet figures and groups', () => {
  it('gives each figure a row, with the reason where it cannot be had', () => {
    const e = evaluate({ ...exampleSpec, tyreSize: '165/80 R15 86X' }, fenlow45, defaultParameters(fenlow45))
    const rows = figureRows(e, exampleSpec, defaultParameters(fenlow45), { power: 'kW+hp', speed: 'km/h' })
    const top = rows.find(r => r.key === 'topSpeedKph')!
    expect(top.value).toBe('—')
    expect(top.reason).toMatch(/tyre/)
    expect(rows.find(r => r.key === 'testMassKg')!.value).toBe('1,130 kg') // 980 + 150
  })

  it('places every controller setting in exactly one group, and names every rule', () => {
    const grouped = groupSettings(fenlow45.schema.properties as never).flatMap(g => g.names)
    expect([...grouped].sort()).toEqual([...PARAMETER_NAMES].sort())
    expect(parameterGroups.flatMap(g => g.roles)).toHaveLength(18)
    const quennel = groupSettings(quennel95.schema.properties as never)
    expect(quennel.at(-1)).toEqual({ id: 'other', title: 'Other settings', names: ['hillHold', 'driveMode', 'throttleMap'] })
    expect(quennel.some(g => g.id === 'creep')).toBe(false)
    expect(Object.keys(ruleTitles).sort()).toEqual([...RULE_IDS].sort())
  })
})
