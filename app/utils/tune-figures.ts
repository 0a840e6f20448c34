// "What it does to this car": the evaluation's figures as the rows of the figures panel.
import type { Evaluation, FigureName } from '~~/shared/compute/types'
import type { VehicleSpec } from '~~/shared/schemas/vehicle-spec'
import { decelText, formatFigure, hoursText, powerText, speedText, type UnitPreference } from './tune-format'

export interface FigureRow { key: string, group: string, label: string, value: string, detail?: string, reason?: string }

const limitWords: Record<string, string> = {
  'speed limit': 'the controller speed limit',
  'motor rpm': 'the motor\'s top speed',
  'road load': 'drag and rolling resistance',
  'torque': 'motor torque',
  'traction': 'the driven tyres\' grip'
}

const g = (x: number | null | undefined) => formatFigure(x, 2)
const num = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? x : null)

export function figureRows(e: Evaluation, spec: VehicleSpec, parameters: Record<string, unknown>, units: UnitPreference): FigureRow[] {
  const f = e.figures
  const why = (name: FigureName) => e.nullReasons[name]
  const grip = f.regenGripLimitMs2
  const row = (key: FigureName | string, group: string, label: string, value: string, detail?: string): FigureRow =>
    ({ key, group, label, value, detail, reason: value.startsWith('—') ? why(key as FigureName) : undefined })
  // The role values in their own units, whatever units the drive unit's settings are in.
  const cap = num(e.roles?.powerCapKw ?? parameters.powerCapKw)
  const controllerA = num(e.roles?.batteryDischargeLimitA ?? parameters.batteryDischargeLimitA)
  return [
    row('zeroTo50S', 'Performance', '0–50 km/h', f.zeroTo50S === null ? '—' : `${formatFigure(f.zeroTo50S, 1)} s`),
    row('zeroTo100S', 'Performance', '0–100 km/h', f.zeroTo100S === null ? '—' : `${formatFigure(f.zeroTo100S, 1)} s`),
    row('topSpeedKph', 'Performance', 'Top speed', speedText(f.topSpeedKph, units),
      f.topSpeedLimitedBy ? `limited by ${limitWords[f.topSpeedLimitedBy] ?? f.topSpeedLimitedBy}` : undefined),
    row('maxWheelForceN', 'Performance', 'Most pull at the wheels', f.maxWheelForceN === null ? '—' : `${formatFigure(f.maxWheelForceN, 0)} N`),
    row('powerRatioToOriginal', 'Performance', 'Power against the original engine', f.powerRatioToOriginal === null ? '—' : `${formatFigure(f.powerRatioToOriginal, 2)} ×`,
      `${powerText(cap, units)} against ${powerText(spec.originalEnginePowerKw, units)}`),
    row('maxStartGradePct', 'Hills and creep', 'Steepest hill start', f.maxStartGradePct === null ? '—' : `${formatFigure(f.maxStartGradePct, 1)} %`,
      f.startGradeLimitedBy ? `limited by ${limitWords[f.startGradeLimitedBy] ?? f.startGradeLimitedBy}` : undefined),
    row('creepHoldGradePct', 'Hills and creep', 'Creep holds the car on', f.creepHoldGradePct === null ? '—' : `${formatFigure(f.creepHoldGradePct, 1)} %`),
    row('liftOffDecelMs2', 'Regenerative braking', 'Lift-off deceleration at 50 km/h', decelText(f.liftOffDecelMs2),
      `grip limit of the driven axle alone: wet ${g(grip.wet)} m/s², snow ${g(grip.snow)} m/s²`),
    row('brakeRegenDecelMs2', 'Regenerative braking', 'Brake regen deceleration at 50 km/h', decelText(f.brakeRegenDecelMs2)),
    row('regenGripLimitMs2', 'Regenerative braking', 'Driven-axle grip limit for regen', `dry ${g(grip.dry)} · wet ${g(grip.wet)} · snow ${g(grip.snow)} m/s²`),
    row('peakDischargeCurrentA', 'Battery', 'Battery current at the power cap', f.peakDischargeCurrentA === null ? '—' : `${formatFigure(f.peakDischargeCurrentA, 0)} A`,
      `controller limit ${formatFigure(controllerA, 0)} A · pack rating ${formatFigure(spec.packMaxDischargeCurrentA, 0)} A`),
    row('chargeTime10to80H', 'Battery', 'Charge 10 → 80 %', hoursText(f.chargeTime10to80H), `on the ${formatFigure(spec.chargerPowerKw, 1)} kW charger`),
    row('tyreLoadPerTyreKg', 'Tyres', 'Load per tyre, front · rear', `${formatFigure(f.tyreLoadPerTyreKg.front, 0)} · ${formatFigure(f.tyreLoadPerTyreKg.rear, 0)} kg`,
      `rated ${formatFigure(f.tyreLoadCapacityKg.front, 0)} · ${formatFigure(f.tyreLoadCapacityKg.rear, 0)} kg`),
    row('tyreSpeedRatingKph', 'Tyres', 'Tyre speed rating', speedText(f.tyreSpeedRatingKph, units),
      f.topSpeedKph === null ? undefined : `top speed ${speedText(f.topSpeedKph, units)}`),
    row('testMassKg', 'Tyres', 'Test mass (kerb + payload)', f.testMassKg === null ? '—' : `${formatFigure(f.testMassKg, 0)} kg`)
  ]
}
