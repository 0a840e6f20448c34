// Regenerative braking: how hard it pulls and how much the driven axle can take (docs/computation.md#regen).
import type { DrivenAxle } from './traction'
import { STANDARD_GRAVITY } from './units'

export const REGEN_REFERENCE_KPH = 50

export interface RegenDrive {
  regenTorqueLimitNm: number
  batteryChargeLimitA: number
  packNominalVoltageV: number
  drivetrainEfficiency: number
}

// Pack current from regen I = T·ω·η/V, so the torque the charge limit allows is T = I·V/(ω·η).
export function chargeLimitedTorqueNm(motorRadS: number, d: RegenDrive): number {
  if (motorRadS <= 0) return Number.POSITIVE_INFINITY
  return (d.batteryChargeLimitA * d.packNominalVoltageV) / (motorRadS * d.drivetrainEfficiency)
}

// Regen torque = regenTorqueLimitNm·pct/100, capped so pack charge current ≤ batteryChargeLimitA.
export function regenTorqueNm(pct: number, motorRadS: number, d: RegenDrive): number {
  const asked = (d.regenTorqueLimitNm * pct) / 100
  return Math.max(0, Math.min(asked, chargeLimitedTorqueNm(motorRadS, d)))
}

// Pack charge current while regenerating, I = T·ω·η/V.
export function regenPackCurrentA(torqueNm: number, motorRadS: number, d: RegenDrive): number {
  return (torqueNm * motorRadS * d.drivetrainEfficiency) / d.packNominalVoltageV
}

// Regen force at the driven wheels F = T·G/r; drivetrain losses are ignored, which errs on the safe side.
export function regenWheelForceN(torqueNm: number, finalDriveRatio: number, rollingRadiusM: number): number {
  return (torqueNm * finalDriveRatio) / rollingRadiusM
}

// Deceleration a = F/m, ignoring rotating inertia, which again errs towards the harsher figure.
export function regenDecelMs2(forceN: number, massKg: number): number {
  return forceN / massKg
}

// Highest deceleration that braking on the driven axle alone can reach before it slides.
// Rear: a = μ·g·s_r/(1 + μ·h/L); front: a = μ·g·(1 − s_r)/(1 − μ·h/L), no more than μ·g; all: μ·g
// (derived from Gillespie's load transfer; check by μ·N_axle(a) − m·a = 0).
export function regenGripLimitMs2(mu: number, axle: DrivenAxle, rearShare: number, hOverL: number): number {
  const whole = mu * STANDARD_GRAVITY
  if (axle === 'all') return whole
  if (axle === 'rear') return (whole * rearShare) / (1 + mu * hOverL)
  const denominator = 1 - mu * hOverL
  return denominator > 0 ? Math.min(whole, (whole * (1 - rearShare)) / denominator) : whole
}
