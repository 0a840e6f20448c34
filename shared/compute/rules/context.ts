// What every safety rule is given, and how it words a warning.
import type { VehicleSpec } from '../../schemas/vehicle-spec'
import { formatNumber } from '../format'
import type { Role, RoleValues } from '../roles'
import type { WorkshopSettings } from '../settings'
import type { Figures, RuleId, Severity, Warning } from '../types'

export interface RuleInput {
  figures: Figures
  parameters: RoleValues // null where the controller lacks the role
  missing?: readonly Role[]
  spec: VehicleSpec
  settings: WorkshopSettings
}

export type Rule = (x: RuleInput) => Warning[]

export const DEFER = 'Check this against local regulations and have a qualified engineer confirm it before the car goes on the road.'

export function warning(rule: RuleId, severity: Severity, message: string, value: number, limit: number): Warning {
  return { rule, severity, message: `${message} ${DEFER}`, value, limit }
}

export const n = (x: number, digits = 3): string => formatNumber(x, digits)

// The driven wheels in plain words, and what happens when they lock under braking.
export function drivenWheels(axle: VehicleSpec['drivenAxle']): { wheels: string, alone: string, lockup: string } {
  if (axle === 'rear') return { wheels: 'the rear wheels', alone: 'the rear wheels alone', lockup: 'the rear wheels could lock and the tail step out' }
  if (axle === 'front') return { wheels: 'the front wheels', alone: 'the front wheels alone', lockup: 'the front wheels could lock and the car run straight on instead of turning' }
  return { wheels: 'all four wheels', alone: 'all four wheels', lockup: 'all four wheels could lock and the car slide' }
}
