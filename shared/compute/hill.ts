// Steepest gradient the car can start on, or creep up, from rest (docs/computation.md#hill-start).
import type { Chassis, DrivenAxle } from './traction'
import { STANDARD_GRAVITY } from './units'

export type GradeLimit = 'torque' | 'traction'

export interface HillInputs {
  wheelForceN: number // at standstill: torque·G·η/r
  chassis: Chassis
  axle: DrivenAxle
  rollingResistanceCoeff: number
  mu: number
}

// Largest tanθ with F = m·g·(sinθ + Crr·cosθ); Infinity when the force beats every slope.
export function torqueLimitedTangent(forceN: number, massKg: number, crr: number): number {
  const q = forceN / (massKg * STANDARD_GRAVITY)
  const amplitude = Math.sqrt(1 + crr * crr) // sinθ + Crr·cosθ = √(1+Crr²)·sin(θ + atan Crr)
  if (q >= amplitude) return Number.POSITIVE_INFINITY
  return Math.max(0, Math.tan(Math.asin(q / amplitude) - Math.atan(crr)))
}

// Largest tanθ with μ·N_driven(θ) = m·g·(sinθ + Crr·cosθ); facing uphill the slope moves
// load m·g·sinθ·h/L from the front axle to the rear (moments about the contact patches).
export function tractionLimitedTangent(x: Omit<HillInputs, 'wheelForceN'>): number {
  const { mu, rollingResistanceCoeff: crr, chassis: c } = x
  const hOverL = c.cgHeightM / c.wheelbaseM
  const wholeCar = mu - crr
  let t = wholeCar
  if (x.axle === 'front') t = (mu * (1 - c.rearShare) - crr) / (1 + mu * hOverL)
  if (x.axle === 'rear') {
    const denominator = 1 - mu * hOverL
    const unclamped = (mu * c.rearShare - crr) / denominator
    // Past the point where the front wheels go light, the rear carries the whole car.
    t = denominator > 0 && c.rearShare + hOverL * unclamped <= 1 ? unclamped : wholeCar
  }
  return Math.max(0, t)
}

// Axle loads on a slope facing uphill, standing still (for checks and charts).
export function slopeAxleLoadsN(c: Chassis, gradePct: number): { front: number, rear: number } {
  const theta = Math.atan(gradePct / 100)
  const weight = c.massKg * STANDARD_GRAVITY
  const rear = weight * (c.rearShare * Math.cos(theta) + (c.cgHeightM / c.wheelbaseM) * Math.sin(theta))
  const normal = weight * Math.cos(theta)
  return { front: normal - Math.min(rear, normal), rear: Math.min(rear, normal) }
}

export function startGrade(x: HillInputs): { gradePct: number, limitedBy: GradeLimit } {
  const byTorque = torqueLimitedTangent(x.wheelForceN, x.chassis.massKg, x.rollingResistanceCoeff)
  const byTraction = tractionLimitedTangent(x)
  return byTorque <= byTraction
    ? { gradePct: 100 * byTorque, limitedBy: 'torque' }
    : { gradePct: 100 * byTraction, limitedBy: 'traction' }
}
