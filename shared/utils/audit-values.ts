// Values as the history shows them: rounded as the trade writes them, with their units, codes as words.
import { vehicleStatusLabels } from '../schemas/vehicle'
import { versionStateLabels } from '../schemas/version'
import { snagKindLabels, snagPriorityLabels, snagStatusLabels } from '../schemas/snag'
import { checkVerdictLabels, surfaceLabels } from '../schemas/road-test'
import { roleLabels } from '../schemas/roles'
import { formatDateTime, isIsoMoment } from './dates'
import { localeNumber } from './number-format'

// A field's unit from the end of its name ("ambientC" is in °C), with the decimals the trade gives it.
const unitSuffixes: [RegExp, string, number][] = [
  [/Ms2$/, 'm/s²', 2], [/Kw$/, 'kW', 1], [/Kph$/, 'km/h', 0], [/Wh$/, 'Wh', 0], [/Pct$/, '%', 1], [/Mm$/, 'mm', 0],
  [/Nm$/, 'N·m', 0], [/Kg$/, 'kg', 0], [/Rpm$/, 'rpm', 0], [/C$/, '°C', 0], [/S$/, 's', 1], [/M$/, 'm', 2], [/V$/, 'V', 0], [/A$/, 'A', 0]
]

export function unitOf(key: string): { unit: string, decimals: number, stem: string } | null {
  for (const [re, unit, decimals] of unitSuffixes) {
    const m = re.exec(key)
    if (m && m.index > 0 && /[a-z0-9]/.test(key[m.index - 1]!)) return { unit, decimals, stem: key.slice(0, m.index) }
  }
  return null
}

// "peakMotorC" → "peak motor", "regen_torque-limit" → "regen torque limit"; the unit is dropped (see unitOf).
export function wordsOf(key: string): string {
  const stem = unitOf(key)?.stem ?? key
  const words = stem.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/([A-Za-z])(\d)/g, '$1 $2').replace(/[_-]+/g, ' ').trim().toLowerCase()
  return words || key
}

// "Peak motor, °C"
export function keyLabel(key: string): string {
  const w = wordsOf(key)
  const unit = unitOf(key)?.unit
  return `${w[0]!.toUpperCase()}${w.slice(1)}${unit ? `, ${unit}` : ''}`
}

// `decimals` fixes the figures after the point; `upTo` only limits them (5 %, 12.5 %).
export function numberText(x: number, decimals?: number, upTo = false): string {
  if (!Number.isFinite(x)) return '—'
  const abs = Math.abs(x)
  const d = decimals ?? (Number.isInteger(x) ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3)
  return localeNumber(x, { minimumFractionDigits: upTo ? 0 : decimals ?? 0, maximumFractionDigits: d })
}

// "1.20 m/s²" (decelerations keep two figures, as the trade compares them), "134 Wh", "9 °C", "5 %"
export function measureText(x: number | null | undefined, key: string): string {
  if (x === null || x === undefined) return '—'
  if (/year/i.test(key) && Number.isInteger(x)) return String(x) // 1967, not 1,967
  const u = unitOf(key)
  return u ? `${numberText(x, u.decimals, u.unit !== 'm/s²')} ${u.unit}` : numberText(x)
}

export function bytesText(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`
  if (bytes < 1024 * 1024) return `${numberText(bytes / 1024, 0)} KiB`
  return `${numberText(bytes / 1024 / 1024, 1)} MiB`
}

const codeWords: Record<string, string> = {
  ...vehicleStatusLabels, ...versionStateLabels, ...snagStatusLabels, ...snagKindLabels, ...snagPriorityLabels,
  ...surfaceLabels, ...checkVerdictLabels, ...roleLabels, workshop: 'In the workshop', roadside: 'At the roadside',
  front: 'Front wheels', rear: 'Rear wheels', all: 'All four wheels',
  file: 'A file from the controller', paste: 'Pasted from the controller', typed: 'Typed in by hand',
  // How a workshop's own road-test check is recorded.
  'pass-fail': 'Pass or fail', 'number': 'A measured number'
}
const codeKeys = new Set(['status', 'state', 'from', 'to', 'fromState', 'kind', 'priority', 'surface', 'verdict', 'roles', 'origin', 'source', 'record', 'drivenAxle'])

export const stageWords = (code: unknown) => typeof code === 'string' ? (vehicleStatusLabels as Record<string, string>)[code]?.toLowerCase() ?? code : 'unknown'

// Any recorded value in words; `key` is the field's name, for its unit and its codes.
// A curve's point (a drive unit's throttle map and the like): pedal → torque.
const isPoint = (v: unknown): v is { x: number, y: number } =>
  v !== null && typeof v === 'object' && !Array.isArray(v) && typeof (v as { x?: unknown }).x === 'number' && typeof (v as { y?: unknown }).y === 'number' && Object.keys(v).length === 2

export function valueText(value: unknown, key = ''): string {
  if (value === undefined) return '—'
  if (value === null) return 'none'
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (typeof value === 'number') return /year/i.test(key) ? String(value) : measureText(value, key) // 1967, not 1,967
  if (typeof value === 'string') {
    if (codeKeys.has(key) && codeWords[value]) return codeWords[value]
    if (isIsoMoment(value) && value.length > 10) return formatDateTime(value)
    return value === '' ? '(empty)' : value
  }
  if (isPoint(value)) return `${value.x} → ${value.y}`
  if (Array.isArray(value)) return value.length ? value.map(v => valueText(v, key)).join(', ') : '(none)'
  if (typeof value === 'object') {
    const entries = Object.entries(value)
    return entries.length ? entries.map(([k, v]) => `${wordsOf(k)} ${valueText(v, k)}`).join('; ') : '(none)'
  }
  return String(value)
}
