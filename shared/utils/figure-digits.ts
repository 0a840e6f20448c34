import { localeNumber } from './number-format'

// How each quantity is written, the same on every screen, sheet and export: whole amps, kilograms, newtons,
// km/h and degrees; seconds, gradients and kW to a tenth; decelerations and power ratios to a hundredth
// (common practice). A figure and a warning about it then never disagree in the last digit.
export const unitDecimals: Record<string, number> = { 'A': 0, 'kg': 0, 'N': 0, 'km/h': 0, 'mm': 0, '°C': 0, 's': 1, '%': 1, 'h': 1, 'kW': 1, 'm/s²': 2, '×': 2, 'm': 3 }

// A number with exactly `decimals` decimals; a dash where there is none.
export function formatFigure(x: number | null | undefined, decimals = 1): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—'
  return localeNumber(x, { minimumFractionDigits: decimals, maximumFractionDigits: decimals })
}

// The number alone, with the decimals its unit takes.
export const figureNumber = (x: number | null | undefined, unit: string): string => formatFigure(x, unitDecimals[unit] ?? 1)
