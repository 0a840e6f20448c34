// A drive unit's setting in words, for every screen and sheet that shows one: the label is the schema's
// title, a number carries its unit (kW with hp, km/h with mph), a switch reads On or Off, a choice its
// label, a curve a short list of points (docs/computation.md, "Settings").
import { kphToMph, kwToHp } from '../compute/units'
import { curveAxes, enumLabels, finite, settingKind, type LooseProperty } from '../compute/setting-kinds'
import { localeNumber } from './number-format'

const MAX_POINTS_SHOWN = 6

// Decimals from the setting's step, so 0.5 kW shows as 0.5 and 1 N·m as 1; at most 3.
function decimalsOf(p: LooseProperty | undefined): number {
  const step = finite(p?.multipleOf) ? p.multipleOf : 0.01
  const text = String(step)
  return Math.min(3, text.includes('.') ? text.split('.')[1]!.length : 0)
}

const plain = (x: number, digits: number) => localeNumber(x, { maximumFractionDigits: digits, useGrouping: false })

export function numberWords(x: number, unit: string | undefined, digits = 2): string {
  if (!Number.isFinite(x)) return '—'
  const v = plain(x, digits)
  if (unit === 'kW') return `${v} kW (${plain(kwToHp(x), 0)} hp)`
  if (unit === 'km/h') return `${v} km/h (${plain(kphToMph(x), 0)} mph)`
  if (unit === 'fraction') return `${v} (${plain(x * 100, 1)} %)`
  return unit ? `${v} ${unit}` : v
}

export const settingLabel = (p: LooseProperty | undefined, name: string): string => typeof p?.title === 'string' && p.title ? p.title : name

const pointWords = (pt: unknown) => {
  const q = (pt ?? {}) as { x?: unknown, y?: unknown }
  return finite(q.x) && finite(q.y) ? `${plain(q.x, 2)} → ${plain(q.y, 2)}` : '?'
}

export function settingValueWords(p: LooseProperty | undefined, value: unknown): string {
  if (value === undefined || value === null) return 'not set'
  const kind = settingKind(p)
  if (typeof value === 'boolean') return value ? 'On' : 'Off'
  if (kind === 'enumeration' && typeof value === 'string') {
    const i = (p!.enum as unknown[]).indexOf(value)
    return i >= 0 ? enumLabels(p!)[i]! : value
  }
  if (Array.isArray(value)) {
    const axes = p ? curveAxes(p) : { x: {}, y: {} }
    const shown = value.slice(0, MAX_POINTS_SHOWN).map(pointWords).join(', ')
    const more = value.length > MAX_POINTS_SHOWN ? ` and ${value.length - MAX_POINTS_SHOWN} more` : ''
    const ux = typeof axes.x.unit === 'string' ? ` ${axes.x.unit}` : ''
    const uy = typeof axes.y.unit === 'string' ? ` ${axes.y.unit}` : ''
    const names = `${settingLabel(axes.x, 'x').toLowerCase()}${ux} → ${settingLabel(axes.y, 'y').toLowerCase()}${uy}`
    return value.length ? `${shown}${more} (${names})` : 'no points'
  }
  if (typeof value === 'number') return numberWords(value, typeof p?.unit === 'string' ? p.unit : undefined, decimalsOf(p))
  return String(value).slice(0, 60)
}
