import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import type { Parameters } from '../../shared/compute/parameters'
import { creepHold, currentLimits, DEFER, derateBand, hillStart, type RuleInput } from '../../shared/compute/rules/index'
import { defaultSettings } from '../../shared/compute/settings'
import type { Figures } from '../../shared/compute/types'
import type { VehicleSpec } from '../../shared/schemas/vehicle-spec'
import { defaultParameters, marrick110, fenlow45 } from '../../shared/platforms/index'

const base = defaultParameters(marrick110)
const figures = evaluate(exampleSpec, marrick110, base).figures
const input = (f: Partial<Figures> = {}, p: Partial<Parameters> = {}, spec: Partial<VehicleSpec> = {}): RuleInput =>
  ({ figures: { ...figures, ...f }, parameters: { ...base, ...p }, spec: { ...exampleSpec, ...spec }, settings: defaultSettings })

describe('current-limits', () => {
  it('danger when the controller may draw more than the pack is rated for', () => {
    const [w] = currentLimits(input({ peakDischargeCurrentA: 100 }, { batteryDischargeLimitA: 400 }, { packMaxDischargeCurrentA: 350 }))
    expect(w).toMatchObject({ rule: 'current-limits', severity: 'danger', value: 400, limit: 350 })
    expect(w!.message.endsWith(DEFER)).toBe(true)
  })

  it('danger when regen may push more into the pack than it accepts', () => {
    const ws = currentLimits(input({ peakDischargeCurrentA: 100 }, { batteryChargeLimitA: 150 }, { packMaxChargeCurrentA: 110 }))
    expect(ws.map(w => [w.severity, w.value, w.limit])).toEqual([['danger', 150, 110]])
  })

  it('info when the power cap needs more current than the controller allows, saying what power is left', () => {
    const ws = currentLimits(input({ peakDischargeCurrentA: 320 }, { batteryDischargeLimitA: 250 }))
    expect(ws).toHaveLength(1)
    expect(ws[0]).toMatchObject({ severity: 'info', value: 320, limit: 250 })
    expect(ws[0]!.message).toMatch(/about 79.9 kW at most/) // 250 A · 355 V · 0.9
  })

  it('nothing when all limits sit inside the pack\'s and the power cap is reachable', () => {
    expect(currentLimits(input({ peakDischargeCurrentA: 200 }, { batteryDischargeLimitA: 300, batteryChargeLimitA: 100 }))).toEqual([])
  })
})

describe('hill-start (workshop minimum, default 20 %, after the UN R13-H parking-brake gradient)', () => {
  it('caution below the minimum, saying what to change for a torque limit and for a traction limit', () => {
    const torque = hillStart(input({ maxStartGradePct: 15, startGradeLimitedBy: 'torque' }))[0]
    expect(torque).toMatchObject({ rule: 'hill-start', severity: 'caution', value: 15, limit: 20 })
    expect(torque!.message).toMatch(/Raise the torque cap/)
    expect(hillStart(input({ maxStartGradePct: 15, startGradeLimitedBy: 'traction' }))[0]!.message).toMatch(/driven wheels spin/)
    expect(hillStart(input({ maxStartGradePct: 20 }))).toEqual([])
  })

  it('end to end: the small unit with a low torque cap on the example car', () => {
    const e = evaluate(exampleSpec, fenlow45, { ...defaultParameters(fenlow45), torqueCapNm: 80 })
    expect(e.figures.maxStartGradePct!).toBeLessThan(20)
    expect(e.warnings.some(w => w.rule === 'hill-start')).toBe(true)
  })
})

describe('creep-hold', () => {
  it('caution when creep is on but cannot hold the minimum slope; nothing with creep off', () => {
    expect(creepHold(input({ creepHoldGradePct: 3 }, { creepTorqueNm: 20 }))[0]).toMatchObject({ rule: 'creep-hold', severity: 'caution', value: 3, limit: 5 })
    expect(creepHold(input({ creepHoldGradePct: 0 }, { creepTorqueNm: 0 }))).toEqual([])
    expect(creepHold(input({ creepHoldGradePct: 5 }, { creepTorqueNm: 20 }))).toEqual([])
  })
})

describe('derate-band', () => {
  it('caution for each sensor whose band is narrower than the workshop minimum', () => {
    const ws = derateBand(input({}, { motorDerateStartC: 140, motorCutoffC: 145, batteryDerateStartC: 50, batteryCutoffC: 58 }))
    expect(ws.map(w => [w.severity, w.value, w.limit])).toEqual([['caution', 5, 10], ['caution', 8, 10]])
    expect(ws[0]!.message).toMatch(/When the motor gets hot/)
    expect(ws[1]!.message).toMatch(/battery pack/)
  })

  it('nothing at the minimum, and nothing for an inverted band, which is a hard error instead', () => {
    expect(derateBand(input({}, { motorDerateStartC: 130, motorCutoffC: 140 }))).toEqual([])
    expect(derateBand(input({}, { motorDerateStartC: 150, motorCutoffC: 140 }))).toEqual([])
  })
})
