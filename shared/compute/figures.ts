// "What it does to this car": every figure of docs/computation.md#figures, null with a reason where it cannot be had.
import type { VehicleSpec } from '../schemas/vehicle-spec'
import { analyseAcceleration } from './acceleration'
import { carModel, chassisOf, regenDrive, testMassKg } from './car-model'
import { chargeTime10to80H, peakDischargeCurrentA } from './currents'
import { motorSpeedRadS, wheelForceN } from './envelope'
import { startGrade } from './hill'
import type { Parameters } from './parameters'
import { regenDecelMs2, regenGripLimitMs2, regenTorqueNm, regenWheelForceN, REGEN_REFERENCE_KPH } from './regen'
import type { WorkshopSettings } from './settings'
import type { CarTyres } from './tyre-input'
import { overallDiameterMm, rollingRadiusM, tyreLoadCapacityKg, tyreSpeedRatingKph } from './tyres'
import type { FigureName, Figures, NullReasons } from './types'
import { kphToMs } from './units'

export interface FigureInputs {
  spec: VehicleSpec
  parameters: Parameters
  motorMaxRpm: number
  settings: WorkshopSettings
  tyres: CarTyres
}

const NEEDS_DRIVEN_TYRE: FigureName[] = ['tyreDiameterMm', 'rollingRadiusM', 'maxWheelForceN', 'zeroTo50S', 'zeroTo100S',
  'topSpeedKph', 'topSpeedLimitedBy', 'maxStartGradePct', 'startGradeLimitedBy', 'creepHoldGradePct', 'liftOffDecelMs2', 'brakeRegenDecelMs2']

export function computeFigures(x: FigureInputs): { figures: Figures, nullReasons: NullReasons } {
  const { spec, parameters: p, settings } = x
  const m = testMassKg(spec)
  const chassis = chassisOf(spec)
  const hOverL = chassis.cgHeightM / chassis.wheelbaseM
  const grip = (mu: number) => regenGripLimitMs2(mu, spec.drivenAxle, chassis.rearShare, hOverL)
  const perTyre = (share: number) => (m * share) / 2
  const driven = drivenTyreFigures(x)
  const figures: Figures = {
    testMassKg: m,
    ...driven.values,
    regenGripLimitMs2: { dry: grip(settings.friction.dry), wet: grip(settings.friction.wet), snow: grip(settings.friction.snow) },
    peakDischargeCurrentA: peakDischargeCurrentA(p.powerCapKw, spec.drivetrainEfficiency, spec.packNominalVoltageV),
    chargeTime10to80H: chargeTime10to80H(spec.packCapacityKwh, spec.chargerPowerKw),
    powerRatioToOriginal: p.powerCapKw / spec.originalEnginePowerKw,
    tyreLoadPerTyreKg: { front: perTyre(1 - chassis.rearShare), rear: perTyre(chassis.rearShare) },
    tyreLoadCapacityKg: {
      front: x.tyres.front ? tyreLoadCapacityKg(x.tyres.front) : null,
      rear: x.tyres.rear ? tyreLoadCapacityKg(x.tyres.rear) : null
    },
    tyreSpeedRatingKph: x.tyres.front && x.tyres.rear ? lowest(tyreSpeedRatingKph(x.tyres.front), tyreSpeedRatingKph(x.tyres.rear)) : null
  }
  return { figures, nullReasons: { ...driven.reasons, ...tyreReasons(x, figures) } }
}

type DrivenTyreFigures = Pick<Figures, 'tyreDiameterMm' | 'rollingRadiusM' | 'maxWheelForceN' | 'zeroTo50S' | 'zeroTo100S' | 'topSpeedKph'
  | 'topSpeedLimitedBy' | 'maxStartGradePct' | 'startGradeLimitedBy' | 'creepHoldGradePct' | 'liftOffDecelMs2' | 'brakeRegenDecelMs2'>

function drivenTyreFigures(x: FigureInputs): { values: DrivenTyreFigures, reasons: NullReasons } {
  const { spec, parameters: p } = x
  if (!x.tyres.driven) {
    const reason = `Needs the ${spec.drivenAxle === 'front' ? 'front' : 'rear'} tyre size, which cannot be read`
    return {
      values: Object.fromEntries(NEEDS_DRIVEN_TYRE.map(k => [k, null])) as unknown as DrivenTyreFigures,
      reasons: Object.fromEntries(NEEDS_DRIVEN_TYRE.map(k => [k, reason]))
    }
  }
  const diameter = overallDiameterMm(x.tyres.driven)
  const r = rollingRadiusM(diameter)
  const car = carModel(spec, p, x.motorMaxRpm, r, x.settings)
  const hill = { chassis: car.chassis, axle: car.axle, rollingResistanceCoeff: spec.rollingResistanceCoeff, mu: car.mu }
  const pull = (torqueNm: number) => wheelForceN(torqueNm, spec.finalDriveRatio, spec.drivetrainEfficiency, r)
  const start = startGrade({ ...hill, wheelForceN: pull(p.torqueCapNm) })
  const accel = analyseAcceleration(car)
  const omega = motorSpeedRadS(kphToMs(REGEN_REFERENCE_KPH), spec.finalDriveRatio, r)
  const regenDecel = (pct: number) => regenDecelMs2(regenWheelForceN(regenTorqueNm(pct, omega, regenDrive(spec, p)), spec.finalDriveRatio, r), testMassKg(spec))
  const values: DrivenTyreFigures = {
    tyreDiameterMm: diameter,
    rollingRadiusM: r,
    maxWheelForceN: pull(p.torqueCapNm),
    zeroTo50S: accel.zeroTo50S,
    zeroTo100S: accel.zeroTo100S,
    topSpeedKph: accel.topSpeedKph,
    topSpeedLimitedBy: accel.topSpeedLimitedBy,
    maxStartGradePct: start.gradePct,
    startGradeLimitedBy: start.limitedBy,
    creepHoldGradePct: startGrade({ ...hill, wheelForceN: pull(p.creepTorqueNm) }).gradePct,
    liftOffDecelMs2: regenDecel(p.liftOffRegenPct),
    brakeRegenDecelMs2: regenDecel(p.brakeRegenPct)
  }
  return { values, reasons: accel.reasons }
}

function lowest(a: number | null, b: number | null): number | null {
  return a === null || b === null ? null : Math.min(a, b)
}

function tyreReasons(x: FigureInputs, f: Figures): NullReasons {
  const out: NullReasons = {}
  const unreadable = [!x.tyres.front && 'front', !x.tyres.rear && 'rear'].filter(Boolean).join(' and ')
  if (f.tyreLoadCapacityKg.front === null || f.tyreLoadCapacityKg.rear === null) out.tyreLoadCapacityKg = `The ${unreadable} tyre size cannot be read`
  if (f.tyreSpeedRatingKph === null) out.tyreSpeedRatingKph = `The ${unreadable} tyre size cannot be read`
  return out
}
