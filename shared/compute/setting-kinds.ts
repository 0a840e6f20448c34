// The kinds of setting a drive unit's schema may declare, and how each one's value is checked by hand
// (no code generation, so the browser can run it under a strict content security policy).
import { withUnit } from './format'

export interface CurvePoint { x: number, y: number }
export type SettingValue = number | boolean | string | CurvePoint[]
export type SettingKind = 'number' | 'integer' | 'boolean' | 'enumeration' | 'curve'
export type LooseProperty = Record<string, unknown>

export const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x)

export function settingKind(p: LooseProperty | undefined): SettingKind | undefined {
  if (!p || typeof p !== 'object') return undefined
  if (Array.isArray(p.enum)) return 'enumeration'
  if (p.type === 'number' || p.type === 'integer' || p.type === 'boolean') return p.type === 'boolean' ? 'boolean' : p.type
  if (p.type === 'array') return 'curve'
  return undefined
}

// A curve's axes as its items' x and y properties describe them.
export function curveAxes(p: LooseProperty): { x: LooseProperty, y: LooseProperty } {
  const props = ((p.items as LooseProperty | undefined)?.properties ?? {}) as Record<string, LooseProperty>
  return { x: props.x ?? {}, y: props.y ?? {} }
}

// A value off the step grid, allowing for binary fractions such as 0.1.
export function offStep(value: number, step: number): boolean {
  const q = value / step
  return Math.abs(q - Math.round(q)) > 1e-9 * Math.max(1, Math.abs(q))
}

export const label = (p: LooseProperty | undefined, name: string): string => typeof p?.title === 'string' ? p.title : name
const unitOf = (p: LooseProperty): string | undefined => typeof p.unit === 'string' ? p.unit : undefined

// What is wrong with a number against its range and step, in words; undefined when nothing is.
export function numberProblem(raw: unknown, p: LooseProperty, what: string, where: string): string | undefined {
  const unit = unitOf(p)
  if (!finite(raw)) return `${what} must be a number`
  if (p.type === 'integer' && !Number.isInteger(raw)) return `${what} must be a whole number`
  if (finite(p.minimum) && raw < p.minimum) return `${what} must be at least ${withUnit(p.minimum, unit)}${where}`
  if (finite(p.maximum) && raw > p.maximum) return `${what} must be at most ${withUnit(p.maximum, unit)}${where}`
  if (finite(p.multipleOf) && p.multipleOf > 0 && offStep(raw, p.multipleOf)) return `${what} goes in steps of ${withUnit(p.multipleOf, unit)}${where}`
  return undefined
}

function curveProblems(raw: unknown, p: LooseProperty, what: string, where: string): string[] {
  if (!Array.isArray(raw)) return [`${what} must be a list of points`]
  const out: string[] = []
  const min = finite(p.minItems) ? p.minItems : 2
  const max = finite(p.maxItems) ? p.maxItems : 64
  if (raw.length < min || raw.length > max) out.push(`${what} needs from ${min} to ${max} points`)
  const axes = curveAxes(p)
  raw.slice(0, max).forEach((point, i) => {
    const pt = (point ?? {}) as Record<string, unknown>
    if (typeof point !== 'object' || Object.keys(pt).some(k => k !== 'x' && k !== 'y')) out.push(`${what}, point ${i + 1}, must be a pair of numbers`)
    for (const axis of ['x', 'y'] as const) {
      const problem = numberProblem(pt[axis], axes[axis], `${what}, point ${i + 1}, ${label(axes[axis], axis)}`, where)
      if (problem) out.push(problem)
    }
    const prev = raw[i - 1] as Record<string, unknown> | undefined
    if (prev && finite(prev.x) && finite(pt.x) && pt.x <= prev.x) out.push(`${what}, point ${i + 1}, must lie further along than point ${i}`)
    if (p['x-monotonic'] === true && prev && finite(prev.y) && finite(pt.y) && pt.y < prev.y) out.push(`${what} must never fall: point ${i + 1} is below point ${i}`)
  })
  return out
}

// Every problem with one setting's value, in words naming the setting.
export function settingProblems(raw: unknown, p: LooseProperty, name: string, where = ''): string[] {
  const what = label(p, name)
  const kind = settingKind(p)
  if (kind === 'number' || kind === 'integer') return [numberProblem(raw, p, what, where)].filter((x): x is string => !!x)
  if (kind === 'boolean') return typeof raw === 'boolean' ? [] : [`${what} must be on or off`]
  if (kind === 'enumeration') return (p.enum as unknown[]).includes(raw) ? [] : [`${what} must be one of ${enumLabels(p).join(', ')}`]
  if (kind === 'curve') return curveProblems(raw, p, what, where)
  return [`${what} is of a kind Voltwright cannot read`]
}

// Labels of an enumeration's choices, from "x-enumTitles" where given.
export function enumLabels(p: LooseProperty): string[] {
  const values = Array.isArray(p.enum) ? p.enum : []
  const titles = Array.isArray(p['x-enumTitles']) ? p['x-enumTitles'] : []
  return values.map((v, i) => typeof titles[i] === 'string' ? titles[i] as string : String(v))
}

// The schema's default, or for a number without one the in-range value nearest zero.
export function fallbackValue(p: LooseProperty): SettingValue {
  const kind = settingKind(p)
  if (p.default !== undefined && settingProblems(p.default, p, '').length === 0) return p.default as SettingValue
  if (kind === 'boolean') return false
  if (kind === 'enumeration') return (p.enum as SettingValue[])[0] ?? ''
  if (kind === 'curve') return []
  const lo = finite(p.minimum) ? p.minimum : Number.NEGATIVE_INFINITY
  const hi = finite(p.maximum) ? p.maximum : Number.POSITIVE_INFINITY
  return Math.min(hi, Math.max(lo, 0))
}

// A usable value whatever was given: numbers clamped into range, anything unreadable replaced by the fallback.
export function usableValue(raw: unknown, p: LooseProperty): SettingValue {
  const kind = settingKind(p)
  if ((kind === 'number' || kind === 'integer') && finite(raw)) {
    const lo = finite(p.minimum) ? p.minimum : Number.NEGATIVE_INFINITY
    const hi = finite(p.maximum) ? p.maximum : Number.POSITIVE_INFINITY
    return Math.min(hi, Math.max(lo, raw))
  }
  return settingProblems(raw, p, '').length === 0 ? raw as SettingValue : fallbackValue(p)
}

// Whether a value is of the kind a setting holds (a number for a number, and so on), whatever its range.
export function fitsKind(p: LooseProperty, v: unknown): boolean {
  const kind = settingKind(p)
  if (kind === 'number' || kind === 'integer') return finite(v)
  if (kind === 'boolean') return typeof v === 'boolean'
  if (kind === 'enumeration') return typeof v === 'string'
  return Array.isArray(v)
}

// Settings a drive unit does not have (their names, each cut to 60 characters, at most 20 of them), and
// values of another kind than their setting holds; a value out of range is not foreign (a draft may hold it;
// it shows as a hard error and blocks submission).
export function foreignSettings(schema: unknown, values: Record<string, unknown>): { unknown: string[], wrongKind: { name: string, message: string }[] } {
  const props = ((schema as { properties?: Record<string, LooseProperty> } | null)?.properties ?? {})
  const names = Object.keys(values)
  const unknown = names.filter(k => !Object.hasOwn(props, k)).slice(0, 20).map(k => k.slice(0, 60))
  const wrongKind = names.filter(k => Object.hasOwn(props, k) && !fitsKind(props[k]!, values[k]))
    .map(k => ({ name: k, message: `Not a value ${label(props[k], k)} can hold` }))
  return { unknown, wrongKind }
}
