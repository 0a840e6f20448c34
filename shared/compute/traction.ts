// How much drive the driven axle can put down, with load transfer (docs/computation.md#traction).
import { STANDARD_GRAVITY } from './units'

export type DrivenAxle = 'front' | 'rear' | 'all'

export interface Chassis {
  massKg: number
  rearShare: number // static share of weight on the rear axle, s_r = 1 − frontAxleLoadPct/100
  cgHeightM: number
  wheelbaseM: number
}

// Axle loads under longitudinal acceleration a (negative when braking): the rear gains m·a·h/L,
// the front loses it (Gillespie, Fundamentals of Vehicle Dynamics, ch. 2); neither below 0 nor above the car's weight.
export function axleLoadsN(c: Chassis, accelMs2: number): { front: number, rear: number } {
  const weight = c.massKg * STANDARD_GRAVITY
  const transfer = (c.massKg * accelMs2 * c.cgHeightM) / c.wheelbaseM
  const rear = clamp(weight * c.rearShare + transfer, 0, weight)
  return { front: weight - rear, rear }
}

// Normal load on the driven wheels; all-wheel drive uses the whole weight.
export function drivenAxleLoadN(c: Chassis, axle: DrivenAxle, accelMs2: number): number {
  if (axle === 'all') return c.massKg * STANDARD_GRAVITY
  return axleLoadsN(c, accelMs2)[axle]
}

// Traction limit F = μ·N_driven(a).
export function tractionLimitN(mu: number, c: Chassis, axle: DrivenAxle, accelMs2: number): number {
  return mu * drivenAxleLoadN(c, axle, accelMs2)
}

export interface AccelerationInputs {
  motorForceN: number
  resistanceN: number
  inertialMassKg: number
  mu: number
  chassis: Chassis
  axle: DrivenAxle
}

// a = (min(F_motor, μ·N(a)) − R)/m_inertial, solved in closed form for the implicit traction case.
export function accelerationMs2(x: AccelerationInputs): number {
  const motorLimited = (x.motorForceN - x.resistanceN) / x.inertialMassKg
  return Math.min(motorLimited, tractionLimitedAccelMs2(x))
}

// Solves m_i·a = μ·(N0 + k·a) − R, where k = ±m·h/L is the load transferred per m/s².
export function tractionLimitedAccelMs2(x: Omit<AccelerationInputs, 'motorForceN'>): number {
  const { chassis: c, mu, resistanceN: r, inertialMassKg: mi } = x
  const weight = c.massKg * STANDARD_GRAVITY
  if (x.axle === 'all') return (mu * weight - r) / mi
  const sign = x.axle === 'rear' ? 1 : -1
  const k = (sign * c.massKg * c.cgHeightM) / c.wheelbaseM
  const n0 = weight * (x.axle === 'rear' ? c.rearShare : 1 - c.rearShare)
  const denominator = mi - mu * k
  if (denominator > 0) {
    const a = (mu * n0 - r) / denominator
    const n = n0 + k * a
    if (n >= 0 && n <= weight) return a
    if (n < 0) return -r / mi
  }
  // The driven axle carries the whole car (the other axle has gone light).
  return (mu * weight - r) / mi
}

export function clamp(x: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, x))
}
