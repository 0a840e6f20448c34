// Turns a spec, parameters and settings into the physical model the figures are computed from.
import type { VehicleSpec } from '../schemas/vehicle-spec'
import type { CarModel } from './acceleration'
import type { Parameters } from './parameters'
import type { RegenDrive } from './regen'
import type { WorkshopSettings } from './settings'
import type { Chassis } from './traction'
import { mmToM } from './units'

export const testMassKg = (spec: VehicleSpec): number => spec.kerbMassKg + spec.payloadKg

// s_r = 1 − frontAxleLoadPct/100 (docs/computation.md#axles).
export const rearShare = (spec: VehicleSpec): number => 1 - spec.frontAxleLoadPct / 100

export function chassisOf(spec: VehicleSpec): Chassis {
  return { massKg: testMassKg(spec), rearShare: rearShare(spec), cgHeightM: mmToM(spec.cgHeightMm), wheelbaseM: mmToM(spec.wheelbaseMm) }
}

export function carModel(spec: VehicleSpec, p: Parameters, motorMaxRpm: number, rollingRadiusM: number, settings: WorkshopSettings): CarModel {
  const massKg = testMassKg(spec)
  return {
    envelope: {
      torqueCapNm: p.torqueCapNm,
      powerCapKw: p.powerCapKw,
      motorMaxRpm,
      speedLimitKph: p.speedLimitKph,
      finalDriveRatio: spec.finalDriveRatio,
      drivetrainEfficiency: spec.drivetrainEfficiency,
      rollingRadiusM
    },
    road: { massKg, rollingResistanceCoeff: spec.rollingResistanceCoeff, dragCoefficient: spec.dragCoefficient, frontalAreaM2: spec.frontalAreaM2 },
    chassis: chassisOf(spec),
    axle: spec.drivenAxle,
    mu: settings.friction.dry, // full-power pulls and hill starts are judged on a dry road
    inertialMassKg: massKg * spec.rotatingMassFactor
  }
}

export function regenDrive(spec: VehicleSpec, p: Parameters): RegenDrive {
  return {
    regenTorqueLimitNm: p.regenTorqueLimitNm,
    batteryChargeLimitA: p.batteryChargeLimitA,
    packNominalVoltageV: spec.packNominalVoltageV,
    drivetrainEfficiency: spec.drivetrainEfficiency
  }
}
