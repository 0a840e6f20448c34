import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { DEFER, regenGripSnow, regenGripWet, stopLamp, type RuleInput } from '../../shared/compute/rules/index'
import { defaultSettings } from '../../shared/compute/settings'
import type { Figures } from '../../shared/compute/types'
import type { VehicleSpec } from '../../shared/schemas/vehicle-spec'
import { defaultParameters, marrick110 } from '../../shared/platforms/index'

const parameters = defaultParameters(marrick110)
const figures = evaluate(exampleSpec, marrick110, parameters).figures

function input(f: Partial<Figures>, spec: Partial<VehicleSpec> = {}): RuleInput {
  return { figures: { ...figures, ...f }, parameters, spec: { ...exampleSpec, ...spec }, settings: defaultSettings }
}

const grip = { dry: 3, wet: 2, snow: 0.8 }

describe('stop-lamp (UN Regulation No. 13-H, para 5.2.22.4)', () => {
  it('at or below 0.7 m/s² the lamps must not light: no warning', () => {
    expect(stopLamp(input({ liftOffDecelMs2: 0.5 }))).toEqual([])
    expect(stopLamp(input({ liftOffDecelMs2: 0.7 }))).toEqual([])
  })

  it('just above 0.7 and up to 1.3 m/s² the lamps may light: info', () => {
    for (const a of [0.71, 1.0, 1.3]) {
      const [w, ...rest] = stopLamp(input({ liftOffDecelMs2: a }))
      expect(rest).toEqual([])
      expect(w).toMatchObject({ rule: 'stop-lamp', severity: 'info', value: a, limit: 0.7 })
    }
  })

  it('above 1.3 m/s² the lamps must light: caution, in plain words', () => {
    const [w] = stopLamp(input({ liftOffDecelMs2: 1.31 }))
    expect(w).toMatchObject({ rule: 'stop-lamp', severity: 'caution', value: 1.31, limit: 1.3 })
    expect(w!.message).toMatch(/stop lamps must light/)
    expect(w!.message.endsWith(DEFER)).toBe(true)
  })

  it('says nothing when the decel cannot be worked out', () => {
    expect(stopLamp(input({ liftOffDecelMs2: null }))).toEqual([])
  })
})

describe('regen-grip-wet and regen-grip-snow (common practice: rear regen alone can step the tail out)', () => {
  it('danger when lift-off regen asks more than the wet grip limit, naming the rear wheels on a rear-driven car', () => {
    const [w] = regenGripWet(input({ liftOffDecelMs2: 2.1, brakeRegenDecelMs2: 1, regenGripLimitMs2: grip }))
    expect(w).toMatchObject({ rule: 'regen-grip-wet', severity: 'danger', value: 2.1, limit: 2 })
    expect(w!.message).toMatch(/^On a wet road, lifting off the accelerator brakes the rear wheels alone/)
    expect(w!.message).toMatch(/tail step out/)
    expect(w!.message.endsWith(DEFER)).toBe(true)
  })

  it('caution above 80 % of the grip limit, nothing at or below it', () => {
    expect(regenGripWet(input({ liftOffDecelMs2: 1.7, brakeRegenDecelMs2: 1, regenGripLimitMs2: grip }))[0])
      .toMatchObject({ severity: 'caution', value: 1.7, limit: 1.6 })
    expect(regenGripWet(input({ liftOffDecelMs2: 1.6, brakeRegenDecelMs2: 1, regenGripLimitMs2: grip }))).toEqual([])
  })

  it('on snow compares with the snow limit instead', () => {
    const a = { liftOffDecelMs2: 0.9, brakeRegenDecelMs2: 0.5, regenGripLimitMs2: grip }
    expect(regenGripSnow(input(a))[0]).toMatchObject({ rule: 'regen-grip-snow', severity: 'danger', limit: 0.8 })
    expect(regenGripSnow(input(a))[0]!.message).toMatch(/^On snow/)
    expect(regenGripWet(input(a))).toEqual([])
  })

  it('brake regen beyond the grip limit is a danger of its own', () => {
    const ws = regenGripSnow(input({ liftOffDecelMs2: 0.2, brakeRegenDecelMs2: 1.2, regenGripLimitMs2: grip }))
    expect(ws).toHaveLength(1)
    expect(ws[0]).toMatchObject({ severity: 'danger', value: 1.2, limit: 0.8 })
    expect(ws[0]!.message).toMatch(/brake regen alone/)
  })

  it('words the front-driven case as running straight on', () => {
    const [w] = regenGripWet(input({ liftOffDecelMs2: 2.5, regenGripLimitMs2: grip }, { drivenAxle: 'front' }))
    expect(w!.message).toMatch(/front wheels alone.*run straight on/)
  })

  it('follows the computed limit end to end: a strong lift-off setting on the example car trips the wet rule', () => {
    const strong = { ...parameters, liftOffRegenPct: 100, regenTorqueLimitNm: 220, batteryChargeLimitA: 300 }
    const e = evaluate({ ...exampleSpec, packMaxChargeCurrentA: 400 }, marrick110, strong)
    expect(e.figures.liftOffDecelMs2!).toBeGreaterThan(e.figures.regenGripLimitMs2.wet!)
    expect(e.warnings.filter(w => w.rule === 'regen-grip-wet').map(w => w.severity)).toContain('danger')
  })
})
