// The on-car settings and figures in plain words for the car's owner (handover sheet).
import { kphToMph, kwToHp, ROLES, roleSettings, schemaProperties, type Evaluation, type Role, type SettingValues } from '../../../shared/compute'
import { settingLabel, settingValueWords } from '../../../shared/utils/setting-words'
import type { HandoverLine } from '../../../shared/schemas/handover'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { localeNumber } from '../../../shared/utils/number-format'
import { hoursText } from '../../../shared/utils/dates'
import { figureNumber } from '../../../shared/utils/figure-digits'

const n = (x: number | null | undefined, digits = 0) => x === null || x === undefined || !Number.isFinite(x) ? '—' : localeNumber(x, { maximumFractionDigits: digits })
// Decelerations keep two decimals, as the trade compares them (0.50 m/s², not 0.5).
const ms2 = (x: number) => `${figureNumber(x, 'm/s²')} m/s²`
const kw = (x: number) => `${n(x, 1)} kW (${n(kwToHp(x))} hp)`
const kph = (x: number | null) => x === null ? '—' : `${n(x)} km/h (${n(kphToMph(x))} mph)`

// Owner's notes for the settings the physics knows, by role; any other setting is shown by its title alone.
const ROLE_NOTES: Partial<Record<Role, string>> = {
  powerCap: 'The most the motor will ever deliver.',
  torqueCap: 'The pull from standstill; it sets how briskly the car moves off.',
  speedLimit: 'Above this the controller gives no more drive.',
  liftOffRegen: 'How strongly the car slows when you lift off the accelerator, like engine braking.',
  brakeRegen: 'Extra slowing from the motor when you press the brake pedal; the brakes still do the rest.',
  creepTorque: 'With both pedals up the car creeps forward gently, like an automatic.',
  motorDerateStart: 'When parts run hot the power fades gradually before it stops.'
}

// Every setting of the drive unit in words: those the physics knows in the role list's order, then the
// rest by label (the stored schema keeps no order of its own).
export function settingLines(schema: unknown, p: SettingValues): HandoverLine[] {
  const roles = Object.fromEntries(Object.entries(roleSettings(schema)).map(([role, name]) => [name, role as Role]))
  const roleOrder = Object.keys(ROLES)
  const rank = (name: string) => (roles[name] ? roleOrder.indexOf(roles[name]) : roleOrder.length)
  const entries = Object.entries(schemaProperties(schema))
    .sort(([a, pa], [b, pb]) => rank(a) - rank(b) || settingLabel(pa, a).localeCompare(settingLabel(pb, b), 'en-GB'))
  return entries.map(([name, prop]) => {
    const note = roles[name] ? ROLE_NOTES[roles[name]] : undefined
    const line = { label: settingLabel(prop, name), value: settingValueWords(prop, p[name]) }
    return note ? { ...line, note } : line
  })
}

export function figureLines(e: Evaluation, spec: VehicleSpec): HandoverLine[] {
  const f = e.figures
  const limited: Record<string, string> = { 'speed limit': 'the speed set', 'motor rpm': 'the motor\'s top revs', 'road load': 'air and road drag' }
  return [
    { label: '0–50 km/h (0–31 mph)', value: f.zeroTo50S === null ? '—' : `${n(f.zeroTo50S, 1)} s` },
    { label: '0–100 km/h (0–62 mph)', value: f.zeroTo100S === null ? 'not reached' : `${n(f.zeroTo100S, 1)} s` },
    { label: 'Top speed', value: kph(f.topSpeedKph), note: f.topSpeedLimitedBy ? `Limited by ${limited[f.topSpeedLimitedBy] ?? f.topSpeedLimitedBy}.` : undefined },
    { label: 'Steepest hill it can start on', value: f.maxStartGradePct === null ? '—' : `${figureNumber(f.maxStartGradePct, '%')} % (1 in ${n(100 / Math.max(f.maxStartGradePct, 0.1))})`, note: f.startGradeLimitedBy === 'traction' ? 'Limited by grip on a dry road.' : 'Limited by the motor\'s torque.' },
    { label: 'Lift-off slowing at 50 km/h', value: f.liftOffDecelMs2 === null ? '—' : ms2(f.liftOffDecelMs2) },
    { label: 'Power against the original engine', value: f.powerRatioToOriginal === null ? '—' : `${figureNumber(f.powerRatioToOriginal, '×')} × the original ${n(spec.originalEnginePowerKw)} kW` },
    { label: 'Charging from 10 % to 80 %', value: f.chargeTime10to80H === null ? '—' : `about ${hoursText(f.chargeTime10to80H)} on a ${n(spec.chargerPowerKw, 1)} kW charger` }
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
