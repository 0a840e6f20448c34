// The drive unit's torque envelope and the force it puts on the road (docs/computation.md#drive-envelope).
import { kphToMs, rpmToRadPerSec } from './units'

export interface DriveEnvelope {
  torqueCapNm: number
  powerCapKw: number
  motorMaxRpm: number
  speedLimitKph: number
  finalDriveRatio: number
  drivetrainEfficiency: number
  rollingRadiusM: number
}

// Motor speed ω = v·G/r (rad/s), G motor revolutions per wheel revolution.
export function motorSpeedRadS(speedMs: number, finalDriveRatio: number, rollingRadiusM: number): number {
  return (speedMs * finalDriveRatio) / rollingRadiusM
}

// Road speed at a motor speed, v = ω·r/G (m/s).
export function roadSpeedMs(motorRadS: number, finalDriveRatio: number, rollingRadiusM: number): number {
  return (motorRadS * rollingRadiusM) / finalDriveRatio
}

// T(ω) = min(torqueCap, powerCap/ω); at standstill the torque cap alone applies.
export function motorTorqueNm(motorRadS: number, torqueCapNm: number, powerCapKw: number): number {
  if (motorRadS <= 0) return Math.max(0, torqueCapNm)
  return Math.max(0, Math.min(torqueCapNm, (powerCapKw * 1000) / motorRadS))
}

// Wheel force F = T·G·η/r (N).
export function wheelForceN(torqueNm: number, finalDriveRatio: number, efficiency: number, rollingRadiusM: number): number {
  return (torqueNm * finalDriveRatio * efficiency) / rollingRadiusM
}

// Highest road speed the motor can turn at, from the platform's motorMaxRpm.
export function motorRpmSpeedMs(env: Pick<DriveEnvelope, 'motorMaxRpm' | 'finalDriveRatio' | 'rollingRadiusM'>): number {
  return roadSpeedMs(rpmToRadPerSec(env.motorMaxRpm), env.finalDriveRatio, env.rollingRadiusM)
}

// Envelope wheel force at a road speed; zero past the motor's max rpm and past the speed limit.
export function envelopeForceN(speedMs: number, env: DriveEnvelope): number {
  if (speedMs > kphToMs(env.speedLimitKph) || speedMs > motorRpmSpeedMs(env)) return 0
  return envelopeForceUncutN(speedMs, env)
}

// The same force without the two cut-offs, for finding where road load balances it.
export function envelopeForceUncutN(speedMs: number, env: DriveEnvelope): number {
  const omega = motorSpeedRadS(speedMs, env.finalDriveRatio, env.rollingRadiusM)
  const torque = motorTorqueNm(omega, env.torqueCapNm, env.powerCapKw)
  return wheelForceN(torque, env.finalDriveRatio, env.drivetrainEfficiency, env.rollingRadiusM)
}
