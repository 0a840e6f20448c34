// The admin's form for the safety thresholds: which settings sit together, what each decides, and how the
// form's values (shares as percentages) turn into the settings the shared schema checks.
import { defaultSettings, settingLimits, type NumberSetting, type WorkshopSettings } from '~~/shared/compute/settings'

// `looser`: which way a change makes Voltwright warn less often.
export interface SettingField { path: NumberSetting, unit: string, step: number, looser: 'higher' | 'lower', help: string }
export interface SettingGroup { key: string, title: string, intro: string, fields: SettingField[] }
export type SettingNumbers = Record<NumberSetting, number | ''>
export type UnitSetting = 'units.power' | 'units.speed'
export type SettingPath = NumberSetting | UnitSetting

export const settingGroups: SettingGroup[] = [
  { key: 'friction', title: 'Tyre grip per surface', intro: 'The friction coefficient μ between tyre and road. Regen is checked against the driven axle\'s grip on wet roads and on snow; full-power pulls and hill starts are judged on a dry road.', fields: [
    { path: 'friction.dry', unit: 'μ', step: 0.01, looser: 'higher', help: 'Handbooks: 0.65 sliding (Noon 1994) to 0.85 peak (Bosch) on dry asphalt.' },
    { path: 'friction.wet', unit: 'μ', step: 0.01, looser: 'higher', help: 'Handbooks: 0.50 sliding (Noon 1994) to 0.65 peak (Bosch) on wet asphalt.' },
    { path: 'friction.snow', unit: 'μ', step: 0.01, looser: 'higher', help: 'Handbooks: 0.20 to 0.25 on snow (Noon 1994); ice is 0.10 to 0.15.' }
  ] },
  { key: 'hill', title: 'Hill start and creep', intro: 'Gradients in percent: metres of climb per 100 m along the road.', fields: [
    { path: 'minStartGradePct', unit: '%', step: 1, looser: 'lower', help: 'A caution when the car cannot pull away from rest on this gradient. 20 % is the UN R13-H parking-brake test gradient.' },
    { path: 'minCreepHoldGradePct', unit: '%', step: 0.5, looser: 'lower', help: 'A caution when creep is switched on but cannot hold the car on this slope: driveways, ramps, queues on a hill.' }
  ] },
  { key: 'powerRatio', title: 'Power against the original engine', intro: 'The drive unit\'s power cap divided by the original engine\'s power: brakes, tyres and suspension were built for the original.', fields: [
    { path: 'powerRatio.caution', unit: 'times', step: 0.1, looser: 'higher', help: 'Above this, a caution: have brakes, tyres, suspension and driveshafts checked.' },
    { path: 'powerRatio.danger', unit: 'times', step: 0.1, looser: 'higher', help: 'Above this, a danger warning: uprate the chassis or lower the power cap.' }
  ] },
  { key: 'derate', title: 'Thermal derate band', intro: 'The gap between derate start and cut-off for the motor, inverter and battery pack.', fields: [
    { path: 'minDerateBandC', unit: '°C', step: 1, looser: 'lower', help: 'A narrower band gives a caution: power would vanish at once instead of fading.' }
  ] },
  { key: 'shares', title: 'How close to a limit a caution comes', intro: 'Past the limit itself the warning is a danger; these set where the caution before it begins.', fields: [
    { path: 'regenGripCautionFraction', unit: '% of the grip', step: 1, looser: 'higher', help: 'A caution once lift-off regen asks for this share of the driven axle\'s grip on a wet road or snow.' },
    { path: 'tyreLoadCautionFraction', unit: '% of the rating', step: 1, looser: 'higher', help: 'A caution once a tyre carries this share of its load rating at test mass.' }
  ] }
]

export const unitChoices: Record<UnitSetting, { name: string, options: { value: string, label: string }[] }> = {
  'units.power': { name: 'Power', options: [{ value: 'kW+hp', label: 'kW, with hp beside it' }, { value: 'kW', label: 'kW only' }] },
  'units.speed': { name: 'Speed', options: [{ value: 'km/h', label: 'km/h only' }, { value: 'mph', label: 'km/h, with mph beside it' }] }
}

const isShare = (path: NumberSetting) => 'share' in settingLimits[path]
const round = (x: number) => Math.round(x * 1e6) / 1e6

export function settingValue(settings: WorkshopSettings, path: SettingPath): number | string {
  return path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown>)[k], settings) as number | string
}

function setPath(out: Record<string, unknown>, path: SettingPath, value: unknown) {
  const [group, key] = path.split('.') as [string, string | undefined]
  out[group] = key ? { ...(out[group] as object | undefined), [key]: value } : value
}

// A number as the form shows it: shares as percentages.
export function shownNumber(settings: WorkshopSettings, path: NumberSetting): number {
  const v = settingValue(settings, path) as number
  return isShare(path) ? round(v * 100) : v
}

export function numbersOf(settings: WorkshopSettings): Record<NumberSetting, number> {
  return Object.fromEntries(Object.keys(settingLimits).map(p => [p, shownNumber(settings, p as NumberSetting)])) as Record<NumberSetting, number>
}

// The form's values as settings for the shared schema: an empty box is null (refused), never the default.
export function settingsFromForm(numbers: SettingNumbers, units: WorkshopSettings['units']): unknown {
  const out: Record<string, unknown> = { units: { ...units } }
  for (const [path, shown] of Object.entries(numbers) as [NumberSetting, number | ''][]) {
    setPath(out, path, shown === '' ? null : isShare(path) ? round(shown / 100) : shown)
  }
  return out
}

export function rangeText(path: NumberSetting): string {
  const l = settingLimits[path]
  return 'share' in l ? 'above 0 % and below 100 %' : `${l.min} to ${l.max}${l.unit}`
}

// A number as shown in the form, with its unit: "0.2", "5 %", "80 %", "1.5 times".
export const numberText = (path: NumberSetting, shown: number) => `${shown}${isShare(path) ? ' %' : settingLimits[path].unit}`

export function settingText(settings: WorkshopSettings, path: SettingPath): string {
  if (path === 'units.power' || path === 'units.speed') return unitChoices[path].options.find(o => o.value === settingValue(settings, path))?.label ?? ''
  return numberText(path, shownNumber(settings, path))
}

export const defaultNumbers = numbersOf(defaultSettings)

const settingPaths: SettingPath[] = [...Object.keys(settingLimits) as NumberSetting[], 'units.power', 'units.speed']
export const settingName = (path: SettingPath) => path === 'units.power' || path === 'units.speed' ? `${unitChoices[path].name} shown as` : settingLimits[path].name

export interface SettingChange { path: SettingPath, name: string, before: string, after: string }

export function settingChanges(before: WorkshopSettings, after: WorkshopSettings): SettingChange[] {
  return settingPaths.filter(p => settingValue(before, p) !== settingValue(after, p))
    .map(path => ({ path, name: settingName(path), before: settingText(before, path), after: settingText(after, path) }))
}

// Only what changed, nested as the API takes it, so a setting another admin saved meanwhile is kept.
export function changedSettings(before: WorkshopSettings, after: WorkshopSettings): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const { path } of settingChanges(before, after)) setPath(out, path, settingValue(after, path))
  return out
}
