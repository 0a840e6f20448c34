// Forces that resist motion on level road (docs/computation.md#road-load).
import { AIR_DENSITY_SEA_LEVEL, STANDARD_GRAVITY } from './units'

export interface RoadLoadInputs {
  massKg: number
  rollingResistanceCoeff: number
  dragCoefficient: number
  frontalAreaM2: number
}

// Rolling resistance F = Crr·m·g.
export function rollingResistanceN(massKg: number, crr: number): number {
  return crr * massKg * STANDARD_GRAVITY
}

// Quadratic drag coefficient c = ½·ρ·Cd·A, so that aero force = c·v².
export function aeroDragCoefficient(dragCoefficient: number, frontalAreaM2: number, airDensity = AIR_DENSITY_SEA_LEVEL): number {
  return 0.5 * airDensity * dragCoefficient * frontalAreaM2
}

// Aerodynamic drag F = ½·ρ·Cd·A·v².
export function aeroDragN(speedMs: number, dragCoefficient: number, frontalAreaM2: number): number {
  return aeroDragCoefficient(dragCoefficient, frontalAreaM2) * speedMs * speedMs
}

// Total road load on the level: rolling plus aero.
export function roadLoadN(speedMs: number, car: RoadLoadInputs): number {
  return rollingResistanceN(car.massKg, car.rollingResistanceCoeff) + aeroDragN(speedMs, car.dragCoefficient, car.frontalAreaM2)
}
