import { describe, expect, it } from 'vitest'
import { evaluate, roleValues, toOwnUnit, fromOwnUnit, type Figures, type PlatformLike } from '../../shared/compute'
import { exampleSpec } from '../../shared/compute/example'
import { corvath130, defaultParameters, marrick110, peltry70, quennel95 } from '../../shared/platforms/index'

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b)

describe('unit conversions against NIST SP 811', () => {
  it('1 hp is 745.699872 W (NIST SP 811, App. B.8, 550 ft·lbf/s)', () => {
    expect(rel(toOwnUnit(1, 'hp', 'power')! * 1000, 745.699872)).toBeLessThan(1e-9)
    expect(toOwnUnit(1000, 'W', 'power')).toBe(1)
  })

  it('1 mile is 1609.344 m exactly, so 1 mph is 1.609344 km/h (NIST SP 811, international mile)', () => {
    expect(toOwnUnit(1, 'mph', 'speed')).toBeCloseTo(1.609344, 12)
    expect(toOwnUnit(60, 'mph', 'speed')).toBeCloseTo(60 * 1609.344 / 1000, 9)
  })

  it('a 0-1 fraction is a hundredfold percentage; °F and K convert to °C (NIST SP 811)', () => {
    expect(toOwnUnit(0.35, 'fraction', 'share')).toBeCloseTo(35, 12)
    expect(toOwnUnit(212, '°F', 'temperature')).toBeCloseTo(100, 12)
    expect(toOwnUnit(273.15, 'K', 'temperature')).toBeCloseTo(0, 12)
  })

  it('1 lbf·ft is 1.3558179 N·m (NIST SP 811)', () => {
    expect(toOwnUnit(1, 'lbf·ft', 'torque')).toBeCloseTo(1.3558179, 7)
  })

  it('converts back, and refuses a unit of another quantity', () => {
    expect(fromOwnUnit(toOwnUnit(93.5, 'hp', 'power')!, 'hp', 'power')).toBeCloseTo(93.5, 10)
    expect(fromOwnUnit(toOwnUnit(98.6, '°F', 'temperature')!, '°F', 'temperature')).toBeCloseTo(98.6, 10)
    expect(toOwnUnit(1, 'kW', 'speed')).toBeNull()
    expect(toOwnUnit(1, 'toString', 'speed')).toBeNull()
  })
})

describe('roleValues', () => {
  it('reads each role in its own unit from a unit working in hp, mph and fractions', () => {
    const r = roleValues(peltry70.schema, { ...defaultParameters(peltry70), powerCapHp: 80, speedLimitMph: 70, liftOffRegen: 0.2 })
    expect(r.values.powerCapKw).toBeCloseTo(80 * 0.745699872, 6)
    expect(r.values.speedLimitKph).toBeCloseTo(70 * 1.609344, 9)
    expect(r.values.liftOffRegenPct).toBeCloseTo(20, 9)
    expect(r.missing).toEqual([])
    expect(r.problems).toEqual([])
  })

  it('turns a motor current in A into torque through the drive unit\'s torque constant', () => {
    const r = roleValues(corvath130.schema, { ...defaultParameters(corvath130), motorCurrentLimitA: 200, regenCurrentLimitA: 100 }, { torqueConstantNmPerA: 0.85 })
    expect(r.values.torqueCapNm).toBeCloseTo(170, 9)
    expect(r.values.regenTorqueLimitNm).toBeCloseTo(85, 9)
  })

  it('without a torque constant a current cannot stand for torque: null, with the reason', () => {
    const r = roleValues(corvath130.schema, defaultParameters(corvath130))
    expect(r.values.torqueCapNm).toBeNull()
    expect(r.problems.map(p => p.path)).toEqual(['parameters.motorCurrentLimitA', 'parameters.regenCurrentLimitA'])
    expect(r.problems[0]!.message).toMatch(/torque constant/)
  })

  it('a role the unit lacks is null and listed as missing, never a default', () => {
    const r = roleValues(quennel95.schema, defaultParameters(quennel95))
    expect(r.missing.sort()).toEqual(['creepSpeed', 'creepTorque', 'throttleProgression'])
    expect(r.values.creepTorqueNm).toBeNull()
    expect(r.values.creepSpeedKph).toBeNull()
  })
})

// A Marrick-like unit in hp, A (with a torque constant) and 0-1 fractions, set to the same physical values.
const imperial: PlatformLike = (() => {
  const props = structuredClone(marrick110.schema.properties) as Record<string, Record<string, unknown>>
  props.powerCapKw = { ...props.powerCapKw, unit: 'hp', minimum: 10, maximum: 150, multipleOf: 0.001 }
  props.torqueCapNm = { ...props.torqueCapNm, unit: 'A', minimum: 10, maximum: 400, multipleOf: 0.001 }
  props.regenTorqueLimitNm = { ...props.regenTorqueLimitNm, unit: 'A', minimum: 0, maximum: 400, multipleOf: 0.001 }
  props.liftOffRegenPct = { ...props.liftOffRegenPct, unit: 'fraction', minimum: 0, maximum: 1, multipleOf: 0.001 }
  props.brakeRegenPct = { ...props.brakeRegenPct, unit: 'fraction', minimum: 0, maximum: 1, multipleOf: 0.001 }
  return { key: 'imperial', name: 'Imperial', motorMaxRpm: marrick110.motorMaxRpm, torqueConstantNmPerA: 0.8, schema: { ...marrick110.schema, properties: props } }
})()

describe('one car on equivalent units', () => {
  it('gives the same figures within 0.5 % on a hp/A/fraction unit as on the kW/N·m/% unit', () => {
    const metric = { ...defaultParameters(marrick110), powerCapKw: 80, torqueCapNm: 220, regenTorqueLimitNm: 100, liftOffRegenPct: 35, brakeRegenPct: 60 }
    // Rounded as a tuner would type them: 80 kW = 107.282 hp; 220 N·m = 275 A and 100 N·m = 125 A at 0.8 N·m/A.
    const other = { ...metric, powerCapKw: 107.282, torqueCapNm: 275, regenTorqueLimitNm: 125, liftOffRegenPct: 0.35, brakeRegenPct: 0.6 }
    const a = evaluate(exampleSpec, marrick110, metric)
    const b = evaluate(exampleSpec, imperial, other)
    expect(a.errors).toEqual([])
    expect(b.errors).toEqual([])
    const numbers = (f: Figures) => Object.entries(f).flatMap(([k, v]) => typeof v === 'number' ? [[k, v] as const] : v && typeof v === 'object' ? Object.entries(v).map(([s, x]) => [`${k}.${s}`, x] as const) : [])
    const bs = Object.fromEntries(numbers(b.figures))
    const compared = numbers(a.figures).filter(([, v]) => v !== null)
    expect(compared.length).toBeGreaterThan(15)
    for (const [k, v] of compared) expect(rel(bs[k] as number, v as number), k).toBeLessThan(0.005)
    expect(b.warnings.map(w => w.rule)).toEqual(a.warnings.map(w => w.rule))
  })
})

describe('a controller without a role', () => {
  const e = evaluate(exampleSpec, quennel95, defaultParameters(quennel95))

  it('leaves the figures that need it null with a plain reason', () => {
    expect(e.errors).toEqual([])
    expect(e.figures.creepHoldGradePct).toBeNull()
    expect(e.nullReasons.creepHoldGradePct).toBe('This controller has no creep setting')
    expect(e.figures.maxStartGradePct).not.toBeNull()
  })

  it('says the creep rule could not be checked, as a caution the road test must cover', () => {
    const w = e.warnings.filter(x => x.rule === 'creep-hold')
    expect(w).toHaveLength(1)
    expect(w[0]).toMatchObject({ severity: 'caution', unchecked: true, value: null, limit: null })
    expect(w[0]!.message).toMatch(/^Could not be checked: this controller has no creep setting\. The road test must cover it/i)
  })

  it('a unit without regen settings gets no regen figures and unchecked regen rules', () => {
    const props = Object.fromEntries(Object.entries(marrick110.schema.properties).filter(([k]) => !/Regen/i.test(k)))
    const bare = { ...marrick110, schema: { ...marrick110.schema, properties: props, required: Object.keys(props) } }
    const r = evaluate(exampleSpec, bare, defaultParameters(bare))
    expect(r.figures.liftOffDecelMs2).toBeNull()
    expect(r.nullReasons.liftOffDecelMs2).toBe('This controller has no regen torque limit setting')
    expect(r.curves.speed.liftOffRegenForceN).toEqual([])
    expect(r.warnings.filter(w => w.unchecked).map(w => w.rule).sort()).toEqual(['regen-grip-snow', 'regen-grip-wet', 'stop-lamp'])
  })

  it('the demo units evaluate without errors at their defaults', () => {
    for (const p of [corvath130, peltry70, quennel95]) expect(evaluate(exampleSpec, p, defaultParameters(p)).errors, p.key).toEqual([])
  })
})
