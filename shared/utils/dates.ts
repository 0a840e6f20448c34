// One way of writing dates across the screens, the sheets and the exports: the workshop's locale
// (en-GB unless it says otherwise), the month in letters so "2 Dec 2026" reads the same everywhere.
import { localeDateParts } from './number-format'
export const DEFAULT_LOCALE = 'en-GB'

type DateInput = string | number | Date
const valid = (x: DateInput) => {
  const d = x instanceof Date ? x : new Date(x)
  return Number.isNaN(d.getTime()) ? null : d
}

// `timeZone` for what is printed away from the screen (the handover sheet writes UTC and says so).
export interface DateOptions { locale?: string, timeZone?: string }

// "2 Dec 2026"
export function formatDate(x: DateInput | null | undefined, o: DateOptions = {}): string {
  const d = x === null || x === undefined ? null : valid(x)
  return d ? localeDateParts(d, { day: 'numeric', month: 'short', year: 'numeric', timeZone: o.timeZone }, o.locale ?? DEFAULT_LOCALE) : '—'
}

// "2 Dec 2026, 14:05"
export function formatDateTime(x: DateInput | null | undefined, o: DateOptions = {}): string {
  const d = x === null || x === undefined ? null : valid(x)
  return d ? `${formatDate(d, o)}, ${localeDateParts(d, { hour: '2-digit', minute: '2-digit', timeZone: o.timeZone }, o.locale ?? DEFAULT_LOCALE)}` : '—'
}

// An ISO moment or day as the history may hold one in its values.
export const isIsoMoment = (s: string) => /^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?)?$/.test(s)
