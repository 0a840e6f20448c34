import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { PARAMETER_NAMES } from '../../shared/compute/parameters'
import type { VehicleSpec } from '../../shared/schemas/vehicle-spec'
import { defaultParameters, marrick110, fenlow45 } from '../../shared/platforms/index'

const FIGURE_NAMES = [ // docs/computation.md#figures, in its order
  'testMassKg', 'tyreDiameterMm', 'rollingRadiusM', 'maxWheelForceN', 'zeroTo50S', 'zeroTo100S', 'topSpeedKph',
  'topSpeedLimitedBy', 'maxStartGradePct', 'startGradeLimitedBy', 'creepHoldGradePct', 'liftOffDecelMs2',
  'brakeRegenDecelMs2', 'regenGripLimitMs2', 'peakDischargeCurrentA', 'chargeTime10to80H', 'powerRatioToOriginal',
  'tyreLoadPerTyreKg', 'tyreLoadCapacityKg', 'tyreSpeedRatingKph'
]

const base = defaultParameters(marrick110)
const run = (params: Record<string, unknown> = base, spec: VehicleSpec = exampleSpec) => evaluate(spec, marrick110, params)
const paths = (e: ReturnType<typeof run>) => e.errors.map(x => x.path)

describe('the shape of an evaluation (docs/computation.md#figures)', () => {
  const e = run()

  it('has exactly the top-level keys and figure names of the contract', () => {
    expect(Object.keys(e).sort()).toEqual(['curves', 'errors', 'figures', 'nullReasons', 'valid', 'warnings'])
    expect(Object.keys(e.figures)).toEqual(FIGURE_NAMES)
    expect(Object.keys(e.figures.regenGripLimitMs2)).toEqual(['dry', 'wet', 'snow'])
    expect(Object.keys(e.figures.tyreLoadPerTyreKg)).toEqual(['front', 'rear'])
  })

  it('is valid with a platform\'s defaults on the example car, every figure filled', () => {
    expect(e.valid).toBe(true)
    expect(e.errors).toEqual([])
    expect(Object.values(e.figures).filter(v => v === null)).toEqual([])
    expect(e.nullReasons).toEqual({})
  })

  it('test mass is kerb plus payload, and tyre loads split the static axle shares between two tyres', () => {
    expect(e.figures.testMassKg).toBe(980 + 150)
    expect(e.figures.tyreLoadPerTyreKg.front).toBeCloseTo((1130 * 0.53) / 2, 9)
    expect(e.figures.tyreLoadPerTyreKg.rear).toBeCloseTo((1130 * 0.47) / 2, 9)
    expect(e.figures.tyreLoadCapacityKg).toEqual({ front: 530, rear: 530 }) // 86 → 530 kg (ETRTO, from memory)
    expect(e.figures.tyreSpeedRatingKph).toBe(180) // S → 180 km/h (ETRTO, from memory)
    expect(e.figures.powerRatioToOriginal).toBeCloseTo(base.powerCapKw / 55, 12)
  })

  it('gives speed curves every 2 km/h from standstill to past the top speed, all the same length', () => {
    const s = e.curves.speed
    expect(s.speedKph[0]).toBe(0)
    expect(s.speedKph[1]).toBe(2)
    expect(s.speedKph.at(-1)!).toBeGreaterThan(e.figures.topSpeedKph!)
    for (const series of [s.wheelForceN, s.powerKw, s.roadLoadN, s.liftOffRegenForceN]) expect(series).toHaveLength(s.speedKph.length)
    expect(s.wheelForceN.at(-1)).toBe(0) // past the speed limit
    expect(Math.max(...s.powerKw)).toBeCloseTo(base.powerCapKw * exampleSpec.drivetrainEfficiency, 0)
  })

  it('gives temperature curves from full torque to none for each sensor', () => {
    const t = e.curves.temperature
    for (const series of [t.motorTorquePct, t.inverterTorquePct, t.batteryTorquePct]) {
      expect(series).toHaveLength(t.temperatureC.length)
      expect(series[0]).toBe(100)
      expect(series.at(-1)).toBe(0)
    }
  })
})

describe('hard errors', () => {
  it('a missing parameter, naming its path and the default used instead', () => {
    const { powerCapKw: _, ...rest } = base
    const e = run(rest)
    expect(e.valid).toBe(false)
    expect(e.errors).toEqual([{ path: 'parameters.powerCapKw', message: expect.stringMatching(/Power cap is missing; the Marrick 110 default is 80 kW/) }])
    expect(e.figures.powerRatioToOriginal).toBeCloseTo(80 / 55, 12)
  })

  it('every parameter missing gives eighteen errors and still the default figures', () => {
    const e = run({})
    expect(paths(e).sort()).toEqual(PARAMETER_NAMES.map(n => `parameters.${n}`).sort())
    expect(e.figures.topSpeedKph).toBeCloseTo(run().figures.topSpeedKph!, 9)
  })

  it('a value that is not a number', () => {
    for (const bad of ['80', Number.NaN, Number.POSITIVE_INFINITY, true, {}]) {
      const e = run({ ...base, powerCapKw: bad })
      expect(e.errors).toEqual([{ path: 'parameters.powerCapKw', message: 'Power cap must be a number' }])
    }
  })

  it('below the minimum or above the maximum, with the figures worked out from the clamped value', () => {
    const high = run({ ...base, torqueCapNm: 900 })
    expect(high.errors).toEqual([{ path: 'parameters.torqueCapNm', message: 'Torque cap must be at most 280 N·m on the Marrick 110' }])
    expect(high.figures.maxWheelForceN).toBeCloseTo(run({ ...base, torqueCapNm: 280 }).figures.maxWheelForceN!, 9)
    expect(run({ ...base, speedLimitKph: 5 }).errors[0]?.message).toMatch(/at least 20 km\/h/)
  })

  it('a value off the platform\'s step', () => {
    expect(run({ ...base, powerCapKw: 80.3 }).errors).toEqual([{ path: 'parameters.powerCapKw', message: 'Power cap goes in steps of 0.5 kW on the Marrick 110' }])
    expect(run({ ...base, powerCapKw: 80.5 }).valid).toBe(true)
  })

  it.each([
    ['motorDerateStartC', 'motorCutoffC', 'motor', 120],
    ['inverterDerateStartC', 'inverterCutoffC', 'inverter', 80],
    ['batteryDerateStartC', 'batteryCutoffC', 'battery', 50]
  ])('%s not below %s', (start, cutoff, sensor, t) => {
    const same = run({ ...base, [start]: t, [cutoff]: t })
    expect(same.valid).toBe(false)
    expect(same.errors).toEqual([{ path: `parameters.${start}`, message: expect.stringMatching(new RegExp(`${sensor} derate start \\(${t} °C\\) must be below the ${sensor} cut-off \\(${t} °C\\)`)) }])
    expect(run({ ...base, [start]: t, [cutoff]: t - 5 }).valid).toBe(false)
    expect(run({ ...base, [start]: t, [cutoff]: t + 1 }).valid).toBe(true)
  })

  it('a parameter the platform does not have', () => {
    expect(run({ ...base, launchControl: 1 }).errors).toEqual([{ path: 'parameters.launchControl', message: '"launchControl" is not a setting of the Marrick 110' }])
  })

  it('an unreadable tyre size: error on spec.tyreSize, tyre figures null with reasons, the rest still given', () => {
    const e = run(base, { ...exampleSpec, tyreSize: '165SR15' })
    expect(e.valid).toBe(false)
    expect(e.errors).toEqual([{ path: 'spec.tyreSize', message: expect.stringMatching(/old-style size/) }])
    for (const k of ['tyreDiameterMm', 'rollingRadiusM', 'zeroTo100S', 'maxStartGradePct', 'liftOffDecelMs2', 'tyreSpeedRatingKph'] as const) {
      expect(e.figures[k]).toBeNull()
      expect(e.nullReasons[k]).toMatch(/cannot be read/)
    }
    expect(e.figures.testMassKg).toBe(1130)
    expect(e.figures.peakDischargeCurrentA).not.toBeNull()
    expect(e.curves.speed.speedKph).toEqual([])
  })

  it('front and rear tyres that differ: the driven axle\'s sets the gearing, the weaker sets the speed rating', () => {
    const spec = { ...exampleSpec, tyreSizeFront: '155/80 R15 82T', tyreSizeRear: '185/70 R15 89H' }
    const e = run(base, spec)
    expect(e.valid).toBe(true)
    expect(e.figures.tyreDiameterMm).toBeCloseTo(25.4 * 15 + 2 * 185 * 0.7, 9)
    expect(e.figures.tyreLoadCapacityKg).toEqual({ front: 475, rear: 580 }) // 82 → 475, 89 → 580 (ETRTO, from memory)
    expect(e.figures.tyreSpeedRatingKph).toBe(190) // T 190 below H 210
    const unreadableRear = run(base, { ...spec, tyreSizeRear: '185/70 R15' })
    expect(paths(unreadableRear)).toEqual(['spec.tyreSizeRear'])
    expect(unreadableRear.figures.tyreLoadCapacityKg).toEqual({ front: 475, rear: null })
    expect(unreadableRear.nullReasons.tyreLoadCapacityKg).toBe('The rear tyre size cannot be read')
  })

  it('a spec out of range or missing a field: errors on spec paths, figures from clamped or example values', () => {
    const e = evaluate({ ...exampleSpec, kerbMassKg: 9000, wheelbaseMm: undefined } as unknown as VehicleSpec, fenlow45, defaultParameters(fenlow45))
    expect(paths(e).sort()).toEqual(['spec.kerbMassKg', 'spec.wheelbaseMm'])
    expect(e.figures.testMassKg).toBe(4000 + 150)
  })

  it('workshop settings that cannot be read fall back to the defaults, and say so', () => {
    const e = evaluate(exampleSpec, marrick110, base, { friction: { dry: 'high' } } as never)
    expect(paths(e)).toEqual(['settings.friction.dry'])
    expect(e.figures.regenGripLimitMs2).toEqual(run().figures.regenGripLimitMs2)
  })

  it('a platform without a usable motor speed limit', () => {
    const e = evaluate(exampleSpec, { ...marrick110, motorMaxRpm: Number.NaN }, base)
    expect(paths(e)).toEqual(['platform.motorMaxRpm'])
    expect(e.figures.topSpeedKph).not.toBeNull()
  })
})
