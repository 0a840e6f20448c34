// Reading a tyre's sidewall designation and the geometry that gearing and load checks need.
import { loadCapacityKg, LOAD_INDEX_MAX, speedRatingKph } from './tyre-tables'

export interface TyreSize {
  designation: string
  widthMm: number
  aspectPct: number
  rimIn: number
  loadIndex: number
  speedSymbol: string
}

export type TyreParseResult = { ok: true, tyre: TyreSize } | { ok: false, message: string }

// Same shape the vehicle spec accepts: "165/80 R15 86S", "205/60R16 92V", "225/45 ZR17 94W".
const MODERN = /^(\d{3})\/(\d{2,3})\s*Z?R\s*(\d{2})\s+(\d{2,3})\s*([A-Z])$/i
const SIZE_ONLY = /^(\d{3})\/(\d{2,3})\s*Z?R\s*(\d{2})$/i
const OLD_STYLE = /^\d{3}\s*[A-Z]{0,2}\s*R\s*\d{2}/i
const NOT_RADIAL = /^\d{3}\/\d{2,3}\s*(-|D|B)\s*\d{2}/i
const EXAMPLE = 'e.g. 165/80 R15 86S'

export function parseTyreSize(text: unknown): TyreParseResult {
  if (typeof text !== 'string' || text.trim() === '') {
    return { ok: false, message: `No tyre size given; write it as on the sidewall, ${EXAMPLE}` }
  }
  const raw = text.trim().replace(/\s+/g, ' ')
  const m = MODERN.exec(raw)
  if (m) return checkServiceDescription(raw, m)
  return { ok: false, message: diagnose(raw) }
}

function checkServiceDescription(raw: string, m: RegExpExecArray): TyreParseResult {
  const [widthMm, aspectPct, rimIn, loadIndex] = [m[1], m[2], m[3], m[4]].map(Number) as [number, number, number, number]
  const speedSymbol = (m[5] ?? '').toUpperCase()
  if (loadCapacityKg(loadIndex) === null) {
    return { ok: false, message: `"${raw}": load index ${loadIndex} is outside the standard table (0 to ${LOAD_INDEX_MAX})` }
  }
  if (speedRatingKph(speedSymbol) === null) {
    return { ok: false, message: `"${raw}": speed symbol "${speedSymbol}" is not in the standard table (B to Y, e.g. S, T, H, V)` }
  }
  return { ok: true, tyre: { designation: raw, widthMm, aspectPct, rimIn, loadIndex, speedSymbol } }
}

function diagnose(raw: string): string {
  if (SIZE_ONLY.test(raw)) {
    return `"${raw}" has no service description; add the load index and speed symbol from the sidewall, ${EXAMPLE}`
  }
  if (NOT_RADIAL.test(raw)) return `"${raw}" is not a radial tyre size; only radial (R) tyres can be checked`
  if (OLD_STYLE.test(raw)) {
    return `"${raw}" is an old-style size without an aspect ratio or load index; write the modern equivalent from the sidewall, ${EXAMPLE}`
  }
  return `"${raw}" is not a tyre size Voltwright can read; write it as on the sidewall, ${EXAMPLE}`
}

// Design overall diameter D = 25.4·rim + 2·width·aspect/100 in mm (ISO 4000-1 / ETRTO).
export function overallDiameterMm(tyre: Pick<TyreSize, 'widthMm' | 'aspectPct' | 'rimIn'>): number {
  return 25.4 * tyre.rimIn + (2 * tyre.widthMm * tyre.aspectPct) / 100
}

// Dynamic rolling radius r = 3.05·D/(2π) in metres (ETRTO rule of thumb for radial tyres).
export function rollingRadiusM(diameterMm: number): number {
  return (3.05 * diameterMm) / 1000 / (2 * Math.PI)
}

export function tyreLoadCapacityKg(tyre: TyreSize): number | null {
  return loadCapacityKg(tyre.loadIndex)
}

export function tyreSpeedRatingKph(tyre: TyreSize): number | null {
  return speedRatingKph(tyre.speedSymbol)
}
