import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { timesToSpeeds } from '../../shared/compute/integrate'
import { AIR_DENSITY_SEA_LEVEL as rho, STANDARD_GRAVITY as g, kphToMs, rpmToRadPerSec } from '../../shared/compute/units'
import { defaultParameters, fenlow45 } from '../../shared/platforms/index'

const within = (actual: number | null, expected: number, tolerance = 0.005) => {
  expect(actual).not.toBeNull()
  expect(Math.abs(actual! - expected) / expected).toBeLessThan(tolerance)
}

describe('the integrator against closed forms, to 0.5 %', () => {
  it('constant force from rest: t = m·v/F', () => {
    const m = 1200
    const F = 3600
    const v = kphToMs(100)
    const [t] = timesToSpeeds(() => F / m, { targetsMs: [v] })
    within(t!, (m * v) / F)
  })

  it('constant power from v1 to v2 without resistance: t = m·(v2² − v1²)/(2P)', () => {
    const m = 1200
    const P = 60_000
    const [t] = timesToSpeeds(v => P / (m * v), { targetsMs: [30], startMs: 5 })
    within(t!, (m * (30 ** 2 - 5 ** 2)) / (2 * P))
  })

  it('constant force with rolling and quadratic drag: t = m/√(c·F′)·atanh(v·√(c/F′))', () => {
    const m = 1200
    const F = 4000
    const crr = 0.012
    const c = 0.5 * rho * 0.35 * 2.0
    const fPrime = F - crr * m * g
    for (const v of [10, 25, 40]) {
      const [t] = timesToSpeeds(u => (fPrime - c * u * u) / m, { targetsMs: [v] })
      within(t!, (m / Math.sqrt(c * fPrime)) * Math.atanh(v * Math.sqrt(c / fPrime)))
    }
  })

  it('stays within 0.5 % at a coarser 0.05 s step', () => {
    const [t] = timesToSpeeds(v => 60_000 / (1200 * v), { targetsMs: [30], startMs: 5, stepS: 0.05 })
    within(t!, (1200 * (900 - 25)) / 120_000)
  })

  it('reports each target in its own place, and null for one not reached in time', () => {
    const [slow, fast] = timesToSpeeds(() => 0.1, { targetsMs: [kphToMs(100), 1] })
    expect(slow).toBeNull() // 278 s needed, 60 s allowed
    within(fast!, 10)
  })

  it('stops when speed no longer rises, leaving higher targets unreached', () => {
    expect(timesToSpeeds(v => 2 - v, { targetsMs: [3] })).toEqual([null])
  })
})

describe('0-50 km/h for a real car in the torque-limited range, against the drag closed form', () => {
  it('matches t = m_i/√(c·F′)·atanh(v·√(c/F′)) with the whole model inside', () => {
    // All-wheel drive and torque low enough that neither power cap nor grip intervenes below 50 km/h.
    const spec = { ...exampleSpec, drivenAxle: 'all' as const }
    const params = { ...defaultParameters(fenlow45), powerCapKw: 45, torqueCapNm: 120 }
    const e = evaluate(spec, fenlow45, params)
    expect(e.valid).toBe(true)
    const r = (3.05 * (25.4 * 15 + 2 * 165 * 0.8)) / 1000 / (2 * Math.PI) // ETRTO rolling radius of 165/80 R15
    expect(params.powerCapKw * 1000 / ((kphToMs(50) * spec.finalDriveRatio) / r)).toBeGreaterThan(params.torqueCapNm)
    const m = spec.kerbMassKg + spec.payloadKg
    const mi = m * spec.rotatingMassFactor
    const F = (120 * spec.finalDriveRatio * spec.drivetrainEfficiency) / r
    const fPrime = F - spec.rollingResistanceCoeff * m * g
    const c = 0.5 * rho * spec.dragCoefficient * spec.frontalAreaM2
    within(e.figures.zeroTo50S, (mi / Math.sqrt(c * fPrime)) * Math.atanh(kphToMs(50) * Math.sqrt(c / fPrime)))
  })
})

describe('top speed and what limits it', () => {
  const base = defaultParameters(fenlow45)

  it('is the speed limit when drive and rpm allow more', () => {
    const e = evaluate(exampleSpec, fenlow45, { ...base, speedLimitKph: 120 })
    expect(e.figures.topSpeedLimitedBy).toBe('speed limit')
    expect(e.figures.topSpeedKph).toBeCloseTo(120, 9)
  })

  it('is the motor\'s max rpm with short gearing: v = ω_max·r/G', () => {
    const spec = { ...exampleSpec, finalDriveRatio: 9.5 }
    const e = evaluate(spec, fenlow45, { ...base, speedLimitKph: 150 })
    expect(e.figures.topSpeedLimitedBy).toBe('motor rpm')
    expect(e.figures.topSpeedKph).toBeCloseTo((rpmToRadPerSec(fenlow45.motorMaxRpm) * e.figures.rollingRadiusM!) / 9.5 * 3.6, 6)
  })

  it('is where power meets road load with a small power cap: P·η/v = Crr·m·g + c·v²', () => {
    const e = evaluate(exampleSpec, fenlow45, { ...base, powerCapKw: 10, speedLimitKph: 150 })
    expect(e.figures.topSpeedLimitedBy).toBe('road load')
    const v = kphToMs(e.figures.topSpeedKph!)
    const m = exampleSpec.kerbMassKg + exampleSpec.payloadKg
    const drive = (10_000 * exampleSpec.drivetrainEfficiency) / v
    const load = exampleSpec.rollingResistanceCoeff * m * g + 0.5 * rho * exampleSpec.dragCoefficient * exampleSpec.frontalAreaM2 * v * v
    expect(Math.abs(drive - load) / load).toBeLessThan(1e-6)
  })

  it('reaches 100 km/h when the speed limit is exactly 100 km/h', () => {
    const e = evaluate(exampleSpec, fenlow45, { ...base, speedLimitKph: 100 })
    expect(e.figures.zeroTo100S).not.toBeNull()
    expect(e.figures.zeroTo100S!).toBeGreaterThan(e.figures.zeroTo50S!)
  })

  it('gives null with a reason for a speed the car never reaches', () => {
    const e = evaluate(exampleSpec, fenlow45, { ...base, speedLimitKph: 45 })
    expect(e.figures.zeroTo50S).toBeNull()
    expect(e.figures.zeroTo100S).toBeNull()
    expect(e.nullReasons.zeroTo50S).toMatch(/Top speed is about 45 km\/h \(limited by the speed limit\)/)
    expect(e.nullReasons.zeroTo100S).toMatch(/100 km\/h is never reached/)
  })
})
