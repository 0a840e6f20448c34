import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { DEFER } from '../../shared/compute/rules/index'
import { workshopSettingsSchema } from '../../shared/compute/settings'
import type { Evaluation, ParameterProperty, Platform } from '../../shared/compute/types'
import { vehicleSpecSchema, type VehicleSpec } from '../../shared/schemas/vehicle-spec'
import { defaultParameters, platforms } from '../../shared/platforms/index'

const num = (min: number, max: number, minExcluded = false) => fc.double({ min, max, minExcluded, noNaN: true, noDefaultInfinity: true })
const pos = (max: number) => num(0, max, true)

const tyre = fc.tuple(fc.integer({ min: 100, max: 999 }), fc.integer({ min: 10, max: 999 }), fc.boolean(), fc.integer({ min: 10, max: 99 }),
  fc.integer({ min: 10, max: 999 }), fc.constantFrom(...'ABCDEFGHJKLMNPQRSTUVWYZ'.split('')))
  .map(([w, a, z, rim, li, s]) => `${w}/${a} ${z ? 'ZR' : 'R'}${rim} ${li}${s}`)

const REQUIRED = ['kerbMassKg', 'payloadKg', 'frontAxleLoadPct', 'wheelbaseMm', 'cgHeightMm', 'tyreSize', 'finalDriveRatio',
  'drivetrainEfficiency', 'dragCoefficient', 'frontalAreaM2', 'rollingResistanceCoeff', 'rotatingMassFactor', 'drivenAxle',
  'originalEnginePowerKw', 'packNominalVoltageV', 'packCapacityKwh', 'packMaxChargeCurrentA', 'packMaxDischargeCurrentA', 'chargerPowerKw'] as const

// Every field over the whole range vehicleSpecSchema allows.
const spec: fc.Arbitrary<VehicleSpec> = fc.record({
  kerbMassKg: pos(4000),
  payloadKg: num(0, 1500),
  frontAxleLoadPct: num(20, 80),
  wheelbaseMm: num(1500, 4500),
  cgHeightMm: num(250, 1200),
  tyreSize: tyre,
  tyreSizeFront: fc.option(tyre, { nil: undefined }),
  tyreSizeRear: fc.option(tyre, { nil: undefined }),
  finalDriveRatio: pos(30),
  drivetrainEfficiency: pos(1),
  dragCoefficient: num(0.15, 1.2),
  frontalAreaM2: num(0.8, 5),
  rollingResistanceCoeff: num(0.004, 0.05),
  rotatingMassFactor: num(1, 1.5),
  drivenAxle: fc.constantFrom('front', 'rear', 'all'),
  originalEnginePowerKw: pos(1000),
  packNominalVoltageV: pos(1000),
  packCapacityKwh: pos(300),
  packMaxChargeCurrentA: pos(2000),
  packMaxDischargeCurrentA: pos(3000),
  chargerPowerKw: pos(400)
}, { requiredKeys: [...REQUIRED] })

// Every parameter anywhere within the platform schema's minimum and maximum.
// Settings that are not numbers stay at their defaults.
const numberSettings = (p: Platform) => Object.entries(p.schema.properties).filter(([, s]) => s.type === 'number') as [string, ParameterProperty][]
const parametersFor = (p: Platform) => fc.record(Object.fromEntries(numberSettings(p).map(([n, s]) => [n, num(s.minimum, s.maximum)])))
  .map(values => ({ ...defaultParameters(p), ...values }))

const friction = fc.tuple(num(0.3, 1.2), num(0.1, 1), num(0.05, 0.5)).map(([a, b, c]) => {
  const [dry, wet, snow] = [a, b, c].sort((x, y) => y - x) as [number, number, number]
  return { dry, wet: Math.min(wet, 1), snow: Math.min(snow, 0.5) }
}).filter(f => workshopSettingsSchema.safeParse({ friction: f }).success)

function nonFinitePaths(value: unknown, path = ''): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path]
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`))
  if (value !== null && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`))
  return []
}

function checkPhysical(e: Evaluation, muDry: number) {
  expect(nonFinitePaths(e)).toEqual([])
  const f = e.figures
  for (const t of [f.zeroTo50S, f.zeroTo100S]) if (t !== null) expect(t).toBeGreaterThanOrEqual(0)
  if (f.zeroTo50S !== null && f.zeroTo100S !== null) expect(f.zeroTo50S).toBeLessThanOrEqual(f.zeroTo100S)
  // No car climbs steeper than tanθ = μ: that needs all of its weight on driven wheels and no rolling loss.
  for (const grade of [f.maxStartGradePct, f.creepHoldGradePct]) {
    if (grade === null) continue
    expect(grade).toBeGreaterThanOrEqual(0)
    expect(grade).toBeLessThanOrEqual(100 * muDry + 1e-9)
  }
  for (const v of [f.liftOffDecelMs2, f.brakeRegenDecelMs2, f.peakDischargeCurrentA, f.topSpeedKph]) if (v !== null) expect(v).toBeGreaterThanOrEqual(0)
  for (const [name, value] of Object.entries(f)) {
    const hasNull = value === null || (typeof value === 'object' && Object.values(value).includes(null))
    if (hasNull) expect(e.nullReasons[name as keyof typeof f], name).toEqual(expect.any(String))
  }
  for (const w of e.warnings) expect(w.message.endsWith(DEFER)).toBe(true)
}

describe('no input within the ranges yields NaN, Infinity, a negative time or an impossible grade', () => {
  it.each(platforms.map(p => [p.key, p] as const))('on the %s', (_key, platform) => {
    fc.assert(fc.property(spec, parametersFor(platform), (s, params) => {
      expect(vehicleSpecSchema.safeParse(s).success).toBe(true)
      checkPhysical(evaluate(s, platform, params), 0.8)
    }), { numRuns: 300 })
  })

  it('with any workshop friction values', () => {
    const platform = platforms[1]!
    fc.assert(fc.property(spec, parametersFor(platform), friction, (s, params, fr) => {
      const settings = workshopSettingsSchema.parse({ friction: fr })
      checkPhysical(evaluate(s, platform, params, settings), fr.dry)
    }), { numRuns: 200 })
  })

  it('nor does garbage in place of a spec or parameters; it gives errors instead of throwing', () => {
    const platform = platforms[0]!
    fc.assert(fc.property(fc.anything(), fc.anything(), (s, params) => {
      const e = evaluate(s as VehicleSpec, platform, params as Record<string, unknown>)
      expect(nonFinitePaths(e)).toEqual([])
      expect(e.valid).toBe(e.errors.length === 0)
    }), { numRuns: 300 })
  })
})
