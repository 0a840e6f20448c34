// The on-car settings and figures in plain words for the car's owner (handover sheet).
import { kphToMph, kwToHp, type Evaluation } from '../../../shared/compute'
import type { HandoverLine } from '../../../shared/schemas/handover'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { schemaProperties } from '../../../shared/compute/parameter-input'
import { keyLabel } from '../../../shared/utils/audit-values'

const n = (x: number | null | undefined, digits = 0) => x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toLocaleString('en-GB', { maximumFractionDigits: digits })
const kw = (x: number) => `${n(x, 1)} kW (${n(kwToHp(x))} hp)`
const kph = (x: number | null) => x === null ? '—' : `${n(x)} km/h (${n(kphToMph(x))} mph)`

// The settings the owner is told about in words, then every other setting on the car by its drive unit's title.
const TOLD = new Set(['powerCapKw', 'torqueCapNm', 'speedLimitKph', 'reverseSpeedLimitKph', 'liftOffRegenPct', 'brakeRegenPct', 'regenTorqueLimitNm', 'creepTorqueNm', 'creepSpeedKph',
  'motorDerateStartC', 'motorCutoffC', 'inverterDerateStartC', 'inverterCutoffC', 'batteryDerateStartC', 'batteryCutoffC', 'batteryDischargeLimitA', 'batteryChargeLimitA'])

function otherLines(p: Record<string, number>, schema: unknown): HandoverLine[] {
  const props = schemaProperties(schema)
  return Object.entries(p).filter(([k]) => !TOLD.has(k)).map(([k, v]) => {
    const prop = props[k] ?? {}
    const unit = typeof prop.unit === 'string' && prop.unit !== '' ? ` ${prop.unit}` : ''
    return { label: String(prop.title ?? keyLabel(k)), value: `${n(v, 2)}${unit}`, ...(typeof prop.description === 'string' ? { note: prop.description } : {}) }
  })
}

export function settingLines(p: Record<string, number>, schema?: unknown): HandoverLine[] {
  return [...toldLines(p), ...otherLines(p, schema)]
}

function toldLines(p: Record<string, number>): HandoverLine[] {
  return [
    { label: 'Most power', value: kw(p.powerCapKw!), note: 'The most the motor will ever deliver.' },
    { label: 'Most torque', value: `${n(p.torqueCapNm)} N·m`, note: 'The pull from standstill; it sets how briskly the car moves off.' },
    { label: 'Top speed set', value: kph(p.speedLimitKph!), note: 'Above this the controller gives no more drive.' },
    { label: 'Reverse speed set', value: kph(p.reverseSpeedLimitKph!) },
    { label: 'Lift-off regen', value: `${n(p.liftOffRegenPct)} % of ${n(p.regenTorqueLimitNm)} N·m`, note: 'How strongly the car slows when you lift off the accelerator, like engine braking.' },
    { label: 'Brake regen', value: `${n(p.brakeRegenPct)} % of ${n(p.regenTorqueLimitNm)} N·m`, note: 'Extra slowing from the motor when you press the brake pedal; the brakes still do the rest.' },
    { label: 'Creep', value: `${n(p.creepTorqueNm)} N·m up to ${kph(p.creepSpeedKph!)}`, note: 'With both pedals up the car creeps forward gently, like an automatic.' },
    { label: 'Motor heat protection', value: `fades from ${n(p.motorDerateStartC)} °C, stops at ${n(p.motorCutoffC)} °C`, note: 'When parts run hot the power fades gradually before it stops.' },
    { label: 'Inverter heat protection', value: `fades from ${n(p.inverterDerateStartC)} °C, stops at ${n(p.inverterCutoffC)} °C` },
    { label: 'Battery heat protection', value: `fades from ${n(p.batteryDerateStartC)} °C, stops at ${n(p.batteryCutoffC)} °C` },
    { label: 'Battery currents', value: `draws at most ${n(p.batteryDischargeLimitA)} A, charges by regen at most ${n(p.batteryChargeLimitA)} A` }
  ]
}

export function figureLines(e: Evaluation, spec: VehicleSpec): HandoverLine[] {
  const f = e.figures
  const limited: Record<string, string> = { 'speed limit': 'the speed set', 'motor rpm': 'the motor\'s top revs', 'road load': 'air and road drag' }
  return [
    { label: '0–50 km/h (0–31 mph)', value: f.zeroTo50S === null ? '—' : `${n(f.zeroTo50S, 1)} s` },
    { label: '0–100 km/h (0–62 mph)', value: f.zeroTo100S === null ? 'not reached' : `${n(f.zeroTo100S, 1)} s` },
    { label: 'Top speed', value: kph(f.topSpeedKph), note: f.topSpeedLimitedBy ? `Limited by ${limited[f.topSpeedLimitedBy] ?? f.topSpeedLimitedBy}.` : undefined },
    { label: 'Steepest hill it can start on', value: f.maxStartGradePct === null ? '—' : `${n(f.maxStartGradePct)} % (1 in ${n(100 / Math.max(f.maxStartGradePct, 0.1))})`, note: f.startGradeLimitedBy === 'traction' ? 'Limited by grip on a dry road.' : 'Limited by the motor\'s torque.' },
    { label: 'Lift-off slowing at 50 km/h', value: f.liftOffDecelMs2 === null ? '—' : `${n(f.liftOffDecelMs2, 2)} m/s²` },
    { label: 'Power against the original engine', value: f.powerRatioToOriginal === null ? '—' : `${n(f.powerRatioToOriginal, 2)} × the original ${n(spec.originalEnginePowerKw)} kW` },
    { label: 'Charging from 10 % to 80 %', value: f.chargeTime10to80H === null ? '—' : `about ${n(f.chargeTime10to80H, 1)} h on a ${n(spec.chargerPowerKw, 1)} kW charger` }
  ]
}

export function carFactLines(spec: VehicleSpec, driveUnit: string): HandoverLine[] {
  const axle = { front: 'front wheels', rear: 'rear wheels', all: 'all four wheels' }[spec.drivenAxle]
  return [
    { label: 'Drive unit', value: `${driveUnit}, driving the ${axle}` },
    { label: 'Kerb mass (converted)', value: `${n(spec.kerbMassKg)} kg` },
    { label: 'Tyres', value: spec.tyreSizeFront && spec.tyreSizeRear ? `front ${spec.tyreSizeFront}, rear ${spec.tyreSizeRear}` : spec.tyreSize },
    { label: 'Battery', value: `${n(spec.packCapacityKwh, 1)} kWh at ${n(spec.packNominalVoltageV)} V` },
    { label: 'Charger', value: `${n(spec.chargerPowerKw, 1)} kW on board` },
    { label: 'Original engine', value: kw(spec.originalEnginePowerKw) }
  ]
}
