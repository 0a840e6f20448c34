import { describe, it, expect } from 'vitest'
import { numericChange, warningDiff, figureDiff } from '../../server/utils/versions/diff-figures'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { defaultParameters, fenlow45 } from '../../shared/platforms/index'
import type { Warning } from '../../shared/compute/types'

const w = (rule: Warning['rule'], severity: Warning['severity'], message: string): Warning => ({ rule, severity, message, value: 1, limit: 1 })

describe('the diff of figures and warnings', () => {
  it('gives the change and the change in percent of the before value (worked by hand)', () => {
    expect(numericChange(40, 30)).toEqual({ change: -10, changePct: -25 })
    expect(numericChange(0.1, 0.3)).toEqual({ change: 0.2, changePct: 200 })
    expect(numericChange(0, 5)).toEqual({ change: 5, changePct: null })
    expect(numericChange(null, 5)).toEqual({ change: null, changePct: null })
    expect(numericChange('torque', 'traction')).toEqual({ change: null, changePct: null })
  })

  it('tells two warnings of one rule apart by their wording, whatever their numbers', () => {
    const before = [w('regen-grip-snow', 'danger', 'On snow, lifting off brakes at 1.6 m/s²'), w('regen-grip-snow', 'danger', 'On snow, brake regen asks for 1.2 m/s²'), w('stop-lamp', 'caution', 'Lamps at 1.6 m/s²')]
    const after = [w('regen-grip-snow', 'danger', 'On snow, brake regen asks for 1.1 m/s²'), w('tyre-speed', 'caution', 'Top speed 190 km/h')]
    const d = warningDiff(before, after)
    expect(d.appeared.map(x => x.rule)).toEqual(['tyre-speed'])
    expect(d.disappeared.map(x => x.message)).toEqual(['On snow, lifting off brakes at 1.6 m/s²', 'Lamps at 1.6 m/s²'])
    expect(d.kept).toHaveLength(1)
    expect(d.kept[0]!.before.message).toContain('brake regen')
  })

  it('pairs what is left of one rule as kept, perhaps at another severity', () => {
    const d = warningDiff([w('regen-grip-wet', 'caution', 'close to the grip')], [w('regen-grip-wet', 'danger', 'more than the grip')])
    expect(d.appeared).toEqual([])
    expect(d.disappeared).toEqual([])
    expect(d.kept[0]!.after.severity).toBe('danger')
  })

  it('flags exactly the figures that a lower power cap moves', () => {
    const p = defaultParameters(fenlow45)
    const a = evaluate(exampleSpec, fenlow45, p)
    const b = evaluate(exampleSpec, fenlow45, { ...p, powerCapKw: p.powerCapKw / 2 })
    const rows = figureDiff(a.figures, b.figures)
    const changed = new Set(rows.filter(r => r.changed).map(r => r.name))
    expect(changed.has('zeroTo100S') || changed.has('zeroTo50S')).toBe(true)
    expect(changed.has('powerRatioToOriginal')).toBe(true)
    for (const fixed of ['testMassKg', 'tyreDiameterMm', 'regenGripLimitMs2.wet', 'chargeTime10to80H']) expect(changed.has(fixed), fixed).toBe(false)
    const ratio = rows.find(r => r.name === 'powerRatioToOriginal')!
    expect(ratio.changePct).toBeCloseTo(-50, 9)
  })
})
