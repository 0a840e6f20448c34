import { describe, expect, it } from 'vitest'
import { regenGripLimitMs2 } from '../../shared/compute/regen'
import { accelerationMs2, axleLoadsN, tractionLimitedAccelMs2, type Chassis } from '../../shared/compute/traction'
import { STANDARD_GRAVITY as g } from '../../shared/compute/units'

describe('load transfer (Gillespie, Fundamentals of Vehicle Dynamics, 1992, ch. 2)', () => {
  const car: Chassis = { massKg: 1200, rearShare: 0.45, cgHeightM: 0.55, wheelbaseM: 2.4 }

  it('under braking the front gains m·a·h/L and the rear loses it', () => {
    const still = axleLoadsN(car, 0)
    const braking = axleLoadsN(car, -4)
    const transfer = (1200 * 4 * 0.55) / 2.4
    expect(braking.front - still.front).toBeCloseTo(transfer, 9)
    expect(still.rear - braking.rear).toBeCloseTo(transfer, 9)
    expect(braking.front + braking.rear).toBeCloseTo(1200 * g, 9)
  })

  it('Halliday worked example (all wheels locked): a 3.92 m/s², about 2.0 kN per rear wheel and 3.5 kN per front (Halliday, Resnick & Walker, 8th ed., ch. 12, answers from memory)', () => {
    const weightN = 11_000
    const L = 4.2
    const behindFront = 1.8
    const chassis: Chassis = { massKg: weightN / g, rearShare: behindFront / L, cgHeightM: 0.75, wheelbaseM: L }
    const a = regenGripLimitMs2(0.4, 'all', chassis.rearShare, 0.75 / L) // all wheels braking: μ·g
    expect(a).toBeCloseTo(3.92, 2)
    const loads = axleLoadsN(chassis, -a)
    expect(loads.rear / 2 / 1000).toBeCloseTo(2.0, 1)
    expect(loads.front / 2 / 1000).toBeCloseTo(3.5, 1)
  })
})

describe('regen grip limit on the driven axle alone (derived from Gillespie load transfer)', () => {
  const chassis: Chassis = { massKg: 1000, rearShare: 0.48, cgHeightM: 0.5, wheelbaseM: 2.3 }
  const hOverL = 0.5 / 2.3

  it.each([0.2, 0.5, 0.8])('rear drive at μ %f: a = μ·g·s_r/(1 + μ·h/L) balances μ·N_rear(a) − m·a = 0', (mu) => {
    const a = regenGripLimitMs2(mu, 'rear', chassis.rearShare, hOverL)
    expect(a).toBeCloseTo((mu * g * 0.48) / (1 + mu * hOverL), 12)
    expect(mu * axleLoadsN(chassis, -a).rear - chassis.massKg * a).toBeCloseTo(0, 6)
  })

  it.each([0.2, 0.5, 0.8])('front drive at μ %f: a = μ·g·(1 − s_r)/(1 − μ·h/L) balances μ·N_front(a) − m·a = 0', (mu) => {
    const a = regenGripLimitMs2(mu, 'front', chassis.rearShare, hOverL)
    expect(mu * axleLoadsN(chassis, -a).front - chassis.massKg * a).toBeCloseTo(0, 6)
  })

  it('all-wheel braking reaches μ·g, and the rear alone reaches less than the front alone (common practice: rear regen is the touchy one)', () => {
    expect(regenGripLimitMs2(0.5, 'all', 0.48, hOverL)).toBeCloseTo(0.5 * g, 12)
    expect(regenGripLimitMs2(0.5, 'rear', 0.48, hOverL)).toBeLessThan(regenGripLimitMs2(0.5, 'front', 0.48, hOverL))
  })

  it('front braking never exceeds μ·g, even when the rear would lift', () => {
    expect(regenGripLimitMs2(1.2, 'front', 0.3, 0.9)).toBeCloseTo(1.2 * g, 12)
  })
})

describe('traction-limited acceleration with load transfer (docs/computation.md#traction)', () => {
  const chassis: Chassis = { massKg: 1100, rearShare: 0.47, cgHeightM: 0.52, wheelbaseM: 2.4 }
  const base = { resistanceN: 150, inertialMassKg: 1100 * 1.05, mu: 0.8, chassis }

  it.each(['front', 'rear'] as const)('%s drive: the solution satisfies m_i·a = μ·N(a) − R when traction-limited', (axle) => {
    const a = accelerationMs2({ ...base, axle, motorForceN: 50_000 })
    const n = axleLoadsN(chassis, a)[axle]
    expect(base.inertialMassKg * a).toBeCloseTo(0.8 * n - 150, 6)
  })

  it('rear drive gains grip under acceleration, front drive loses it, all-wheel uses the whole weight', () => {
    const x = { ...base, motorForceN: 50_000 }
    const rear = accelerationMs2({ ...x, axle: 'rear' })
    const front = accelerationMs2({ ...x, axle: 'front' })
    const all = accelerationMs2({ ...x, axle: 'all' })
    expect(rear).toBeGreaterThan((0.8 * 0.47 * 1100 * g - 150) / base.inertialMassKg)
    expect(front).toBeLessThan((0.8 * 0.53 * 1100 * g - 150) / base.inertialMassKg)
    expect(all).toBeCloseTo((0.8 * 1100 * g - 150) / base.inertialMassKg, 9)
  })

  it('below the grip limit the motor decides: a = (F − R)/m_i', () => {
    const a = accelerationMs2({ ...base, axle: 'rear', motorForceN: 2000 })
    expect(a).toBeCloseTo((2000 - 150) / base.inertialMassKg, 12)
  })

  it('when the front wheels go light the rear carries the whole car, no more', () => {
    const tall: Chassis = { massKg: 1000, rearShare: 0.6, cgHeightM: 1.2, wheelbaseM: 1.5 }
    const a = tractionLimitedAccelMs2({ resistanceN: 0, inertialMassKg: 1000, mu: 1.2, chassis: tall, axle: 'rear' })
    expect(a).toBeCloseTo(1.2 * g, 9)
  })
})
