import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { slopeAxleLoadsN, startGrade, torqueLimitedTangent, tractionLimitedTangent } from '../../shared/compute/hill'
import type { Chassis } from '../../shared/compute/traction'
import { STANDARD_GRAVITY as g } from '../../shared/compute/units'
import { ulvane220, defaultParameters, fenlow45 } from '../../shared/platforms/index'

const chassis: Chassis = { massKg: 1130, rearShare: 0.47, cgHeightM: 0.52, wheelbaseM: 2.4 }
const crr = 0.011

// Normal load on each axle facing uphill, by moments about the other axle's contact patch.
function uphillLoads(c: Chassis, theta: number) {
  const w = c.massKg * g
  const cgBehindFront = c.rearShare * c.wheelbaseM
  const rear = (w * Math.cos(theta) * cgBehindFront + w * Math.sin(theta) * c.cgHeightM) / c.wheelbaseM
  const front = (w * Math.cos(theta) * (c.wheelbaseM - cgBehindFront) - w * Math.sin(theta) * c.cgHeightM) / c.wheelbaseM
  return { front, rear }
}

describe('hill start, torque-limited: F = m·g·(sinθ + Crr·cosθ) (docs/computation.md#hill-start)', () => {
  it.each([1000, 3000, 6000])('with %d N at the wheels the reported gradient balances the forces', (F) => {
    const theta = Math.atan(torqueLimitedTangent(F, chassis.massKg, crr))
    expect(chassis.massKg * g * (Math.sin(theta) + crr * Math.cos(theta))).toBeCloseTo(F, 6)
  })

  it('is zero when the force cannot even overcome rolling resistance', () => {
    expect(torqueLimitedTangent(0.5 * crr * chassis.massKg * g, chassis.massKg, crr)).toBe(0)
  })
})

describe('hill start, traction-limited, with the slope moving load onto the rear axle', () => {
  it.each([0.5, 0.8, 1.0])('rear drive at μ %f: μ·N_rear(θ) = m·g·(sinθ + Crr·cosθ)', (mu) => {
    const theta = Math.atan(tractionLimitedTangent({ chassis, axle: 'rear', rollingResistanceCoeff: crr, mu }))
    expect(mu * uphillLoads(chassis, theta).rear).toBeCloseTo(chassis.massKg * g * (Math.sin(theta) + crr * Math.cos(theta)), 6)
  })

  it.each([0.5, 0.8, 1.0])('front drive at μ %f: μ·N_front(θ) = m·g·(sinθ + Crr·cosθ)', (mu) => {
    const theta = Math.atan(tractionLimitedTangent({ chassis, axle: 'front', rollingResistanceCoeff: crr, mu }))
    expect(mu * uphillLoads(chassis, theta).front).toBeCloseTo(chassis.massKg * g * (Math.sin(theta) + crr * Math.cos(theta)), 6)
  })

  it.each([0, 10, 25, 40])('slopeAxleLoadsN agrees with moments about the contact patches at %d %', (pct) => {
    const mine = slopeAxleLoadsN(chassis, pct)
    const byMoments = uphillLoads(chassis, Math.atan(pct / 100))
    expect(mine.rear).toBeCloseTo(byMoments.rear, 6)
    expect(mine.front).toBeCloseTo(byMoments.front, 6)
  })

  it('all-wheel drive manages tanθ = μ − Crr, the most any car can; rear beats front on an uphill start', () => {
    const x = { chassis, rollingResistanceCoeff: crr, mu: 0.8 }
    const all = tractionLimitedTangent({ ...x, axle: 'all' })
    expect(all).toBeCloseTo(0.8 - crr, 12)
    expect(tractionLimitedTangent({ ...x, axle: 'rear' })).toBeGreaterThan(tractionLimitedTangent({ ...x, axle: 'front' }))
    expect(tractionLimitedTangent({ ...x, axle: 'rear' })).toBeLessThan(all)
  })

  it('takes the lower of torque and traction and says which', () => {
    const x = { chassis, axle: 'rear' as const, rollingResistanceCoeff: crr, mu: 0.8 }
    expect(startGrade({ ...x, wheelForceN: 2000 }).limitedBy).toBe('torque')
    const strong = startGrade({ ...x, wheelForceN: 20_000 })
    expect(strong.limitedBy).toBe('traction')
    expect(strong.gradePct).toBeCloseTo(100 * tractionLimitedTangent(x), 9)
  })
})

describe('hill-start figures from evaluate', () => {
  it('a small drive unit on the example car is torque-limited, a large one traction-limited', () => {
    const small = evaluate(exampleSpec, fenlow45, defaultParameters(fenlow45))
    const large = evaluate(exampleSpec, ulvane220, defaultParameters(ulvane220))
    expect(small.figures.startGradeLimitedBy).toBe('torque')
    expect(large.figures.startGradeLimitedBy).toBe('traction')
    expect(large.figures.maxStartGradePct!).toBeLessThanOrEqual(100 * 0.8)
  })

  it('creep with no torque holds nothing; more creep torque holds a steeper slope', () => {
    const base = defaultParameters(fenlow45)
    const off = evaluate(exampleSpec, fenlow45, { ...base, creepTorqueNm: 0 })
    const low = evaluate(exampleSpec, fenlow45, { ...base, creepTorqueNm: 20 })
    const high = evaluate(exampleSpec, fenlow45, { ...base, creepTorqueNm: 50 })
    expect(off.figures.creepHoldGradePct).toBe(0)
    expect(high.figures.creepHoldGradePct!).toBeGreaterThan(low.figures.creepHoldGradePct!)
  })
})
