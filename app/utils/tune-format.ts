// How the tune sheet shows numbers: a few figures, the unit always beside, kW with hp, km/h with mph on request.
import { kphToMph, kwToHp, STANDARD_GRAVITY } from '~~/shared/compute/units'
import type { WorkshopSettings } from '~~/shared/compute/settings'
import { formatFigure } from '~~/shared/utils/figure-digits'

export type UnitPreference = WorkshopSettings['units']

export const defaultUnits: UnitPreference = { power: 'kW+hp', speed: 'km/h' }

export { formatFigure }

export function powerText(kw: number | null | undefined, units: UnitPreference = defaultUnits): string {
  if (kw === null || kw === undefined || !Number.isFinite(kw)) return '—'
  const main = `${formatFigure(kw, kw < 10 ? 1 : 0)} kW`
  return units.power === 'kW+hp' ? `${main} (${formatFigure(kwToHp(kw), 0)} hp)` : main
}

export function speedText(kph: number | null | undefined, units: UnitPreference = defaultUnits): string {
  if (kph === null || kph === undefined || !Number.isFinite(kph)) return '—'
  const main = `${formatFigure(kph, 0)} km/h`
  return units.speed === 'mph' ? `${main} (${formatFigure(kphToMph(kph), 0)} mph)` : main
}

// Deceleration in m/s² and in g (standard gravity, 3rd CGPM 1901), as drivers and engineers both read it.
export function decelText(ms2: number | null | undefined): string {
  if (ms2 === null || ms2 === undefined || !Number.isFinite(ms2)) return '—'
  // No-break spaces: a narrow column breaks between the two figures, never inside one.
  return `${formatFigure(ms2, 2)}\u00a0m/s² (${formatFigure(ms2 / STANDARD_GRAVITY, 2)}\u00a0g)`
}

// The other unit beside a parameter's own, when the workshop wants it: hp beside kW, mph beside km/h.
export function secondUnit(value: unknown, unit: string | undefined, units: UnitPreference = defaultUnits): string | null {
  if (typeof value !== 'number' || !Number.isFinite(value)) return null
  if (unit === 'kW' && units.power === 'kW+hp') return `${formatFigure(kwToHp(value), 0)} hp`
  if (unit === 'km/h' && units.speed === 'mph') return `${formatFigure(kphToMph(value), 1)} mph`
  return null
}

export { hoursText } from '~~/shared/utils/dates'
