// The units a drive unit's schema may give a setting in, grouped by quantity, and how each converts to
// the quantity's own unit (the unit the computation works in); see docs/computation.md, "Units".
import { HORSEPOWER_W, KPH_PER_MPH, NM_PER_LBF_FT } from './units'

export type Quantity = 'power' | 'torque' | 'share' | 'speed' | 'temperature' | 'current'

interface Scale { factor: number, offset?: number } // own = value·factor + offset

// The first unit of each quantity is its own unit.
export const QUANTITY_UNITS: Readonly<Record<Quantity, Readonly<Record<string, Scale>>>> = {
  power: { 'kW': { factor: 1 }, 'W': { factor: 0.001 }, 'hp': { factor: HORSEPOWER_W / 1000 } },
  torque: { 'N·m': { factor: 1 }, 'Nm': { factor: 1 }, 'lbf·ft': { factor: NM_PER_LBF_FT } },
  share: { '%': { factor: 1 }, 'fraction': { factor: 100 } },
  speed: { 'km/h': { factor: 1 }, 'mph': { factor: KPH_PER_MPH } },
  temperature: { '°C': { factor: 1 }, '°F': { factor: 1 / 1.8, offset: -32 / 1.8 }, 'K': { factor: 1, offset: -273.15 } },
  current: { A: { factor: 1 } }
}

export const ownUnit = (q: Quantity): string => Object.keys(QUANTITY_UNITS[q])[0]!

export function quantityOfUnit(unit: string): Quantity | undefined {
  return (Object.keys(QUANTITY_UNITS) as Quantity[]).find(q => Object.hasOwn(QUANTITY_UNITS[q], unit))
}

// A value in `unit` expressed in the quantity's own unit, or null when the unit is not one of its.
export function toOwnUnit(value: number, unit: string, q: Quantity): number | null {
  const scale = Object.hasOwn(QUANTITY_UNITS[q], unit) ? QUANTITY_UNITS[q][unit]! : undefined
  return scale ? value * scale.factor + (scale.offset ?? 0) : null
}

// The reverse, for showing a figure in the unit a schema uses.
export function fromOwnUnit(value: number, unit: string, q: Quantity): number | null {
  const scale = Object.hasOwn(QUANTITY_UNITS[q], unit) ? QUANTITY_UNITS[q][unit]! : undefined
  return scale ? (value - (scale.offset ?? 0)) / scale.factor : null
}

// Every unit a schema may name, for the upload checks and the form.
export const KNOWN_UNITS: readonly string[] = Object.values(QUANTITY_UNITS).flatMap(u => Object.keys(u))
