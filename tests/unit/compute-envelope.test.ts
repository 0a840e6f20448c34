import { describe, expect, it } from 'vitest'
import {
  envelopeForceN, envelopeForceUncutN, motorRpmSpeedMs, motorSpeedRadS, motorTorqueNm, wheelForceN, type DriveEnvelope
} from '../../shared/compute/envelope'
import { aeroDragCoefficient, aeroDragN, roadLoadN, rollingResistanceN } from '../../shared/compute/roadload'
import { kphToMs, rpmToRadPerSec } from '../../shared/compute/units'

const env: DriveEnvelope = {
  torqueCapNm: 200, powerCapKw: 80, motorMaxRpm: 10000, speedLimitKph: 120, finalDriveRatio: 8, drivetrainEfficiency: 0.9, rollingRadiusM: 0.3
}

describe('drive envelope T(ω) = min(torqueCap, powerCap/ω) (docs/computation.md#drive-envelope)', () => {
  it('gives the torque cap below base speed and constant power above it', () => {
    const base = (80_000 / 200) // ω where the two caps meet, rad/s
    expect(motorTorqueNm(0, 200, 80)).toBe(200)
    expect(motorTorqueNm(0.5 * base, 200, 80)).toBe(200)
    expect(motorTorqueNm(2 * base, 200, 80)).toBeCloseTo(100, 9)
    expect(motorTorqueNm(3 * base, 200, 80) * 3 * base).toBeCloseTo(80_000, 6)
  })

  it('motor speed is ω = v·G/r and wheel force F = T·G·η/r', () => {
    expect(motorSpeedRadS(15, 8, 0.3)).toBeCloseTo(400, 9)
    expect(wheelForceN(200, 8, 0.9, 0.3)).toBeCloseTo(4800, 9)
  })

  it('puts the power cap times drivetrain efficiency on the road above base speed', () => {
    const v = 30
    expect(envelopeForceN(v, env) * v).toBeCloseTo(80_000 * 0.9, 6)
  })

  it('is zero past the speed limit, and just below it still pulls', () => {
    expect(envelopeForceN(kphToMs(120) * 0.999, env)).toBeGreaterThan(0)
    expect(envelopeForceN(kphToMs(121), env)).toBe(0)
    expect(envelopeForceUncutN(kphToMs(121), env)).toBeGreaterThan(0)
  })

  it('is zero past the motor\'s max rpm', () => {
    const rpmLimited = { ...env, speedLimitKph: 400 }
    const vMax = motorRpmSpeedMs(rpmLimited)
    expect(vMax).toBeCloseTo((rpmToRadPerSec(10000) * 0.3) / 8, 9)
    expect(envelopeForceN(vMax * 0.999, rpmLimited)).toBeGreaterThan(0)
    expect(envelopeForceN(vMax * 1.001, rpmLimited)).toBe(0)
  })
})

describe('road load (docs/computation.md#road-load)', () => {
  it('rolling resistance is Crr·m·g', () => {
    expect(rollingResistanceN(1000, 0.01)).toBeCloseTo(98.0665, 9)
  })

  it('aero drag is ½·ρ·Cd·A·v² with ρ = 1.225 kg/m³ (ISO 2533)', () => {
    expect(aeroDragCoefficient(0.4, 2)).toBeCloseTo(0.5 * 1.225 * 0.4 * 2, 12)
    expect(aeroDragN(30, 0.4, 2)).toBeCloseTo(0.49 * 900, 9)
    // Quadratic: doubling speed quadruples drag.
    expect(aeroDragN(kphToMs(100), 0.4, 2) / aeroDragN(kphToMs(50), 0.4, 2)).toBeCloseTo(4, 12)
  })

  it('adds the two', () => {
    const car = { massKg: 1100, rollingResistanceCoeff: 0.012, dragCoefficient: 0.45, frontalAreaM2: 1.9 }
    expect(roadLoadN(25, car)).toBeCloseTo(rollingResistanceN(1100, 0.012) + aeroDragN(25, 0.45, 1.9), 9)
    expect(roadLoadN(0, car)).toBeCloseTo(rollingResistanceN(1100, 0.012), 12)
  })
})
