// Which role values each figure needs, and the plain reason a figure is null when the controller lacks one.
import type { ParameterName } from './parameters'
import { noSetting, ROLE_NAMES, ROLES, type Role, type RoleValues } from './roles'
import type { FigureName, NullReasons } from './types'

const ENVELOPE: ParameterName[] = ['torqueCapNm', 'powerCapKw', 'speedLimitKph']
const LIFT_OFF: ParameterName[] = ['regenTorqueLimitNm', 'liftOffRegenPct', 'batteryChargeLimitA']
const BRAKE: ParameterName[] = ['regenTorqueLimitNm', 'brakeRegenPct', 'batteryChargeLimitA']

export const FIGURE_NEEDS: Partial<Record<FigureName, ParameterName[]>> = {
  maxWheelForceN: ['torqueCapNm'],
  zeroTo50S: ENVELOPE,
  zeroTo100S: ENVELOPE,
  topSpeedKph: ENVELOPE,
  topSpeedLimitedBy: ENVELOPE,
  maxStartGradePct: ['torqueCapNm'],
  startGradeLimitedBy: ['torqueCapNm'],
  creepHoldGradePct: ['creepTorqueNm'],
  liftOffDecelMs2: LIFT_OFF,
  brakeRegenDecelMs2: BRAKE,
  peakDischargeCurrentA: ['powerCapKw'],
  powerRatioToOriginal: ['powerCapKw']
}

export const roleOfField = (field: ParameterName): Role => ROLE_NAMES.find(r => ROLES[r].field === field)!

// The first needed role value that is null, if any.
export function firstAbsent(p: RoleValues, needs: readonly ParameterName[]): ParameterName | undefined {
  return needs.find(f => p[f] === null)
}

// The role values a calculation needs, as plain numbers, or null when any is absent.
export function numbersFor<K extends ParameterName>(p: RoleValues, needs: readonly K[]): Record<K, number> | null {
  return firstAbsent(p, needs) === undefined ? p as Record<K, number> : null
}

// Why a role value is null: the controller has no such setting, or its setting could not be read.
export function absentReason(field: ParameterName, missing: readonly Role[]): string {
  const role = roleOfField(field)
  return missing.includes(role) ? noSetting(role) : `The ${ROLES[role].words} setting cannot be read in its unit`
}

// Nulls every figure whose role values are absent, with the reason beside it.
export function nullAbsentFigures(figures: Record<string, unknown>, reasons: NullReasons, p: RoleValues, missing: readonly Role[]): void {
  for (const [figure, needs] of Object.entries(FIGURE_NEEDS) as [FigureName, ParameterName[]][]) {
    const absent = firstAbsent(p, needs)
    if (absent === undefined) continue
    figures[figure] = null
    reasons[figure] = absentReason(absent, missing)
  }
}
