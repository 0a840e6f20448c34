// The role values the computation works with, by the name of each role's quantity in its own unit
// (powerCapKw in kW, ...); a drive unit's settings map onto them through "x-role" (docs/computation.md#roles).

export const PARAMETER_NAMES = [
  'powerCapKw',
  'torqueCapNm',
  'regenTorqueLimitNm',
  'liftOffRegenPct',
  'brakeRegenPct',
  'creepTorqueNm',
  'creepSpeedKph',
  'speedLimitKph',
  'reverseSpeedLimitKph',
  'throttleProgression',
  'motorDerateStartC',
  'motorCutoffC',
  'inverterDerateStartC',
  'inverterCutoffC',
  'batteryDerateStartC',
  'batteryCutoffC',
  'batteryDischargeLimitA',
  'batteryChargeLimitA'
] as const

export type ParameterName = (typeof PARAMETER_NAMES)[number]
export type Parameters = Record<ParameterName, number>

// Derate start and cut-off pairs that must stay in order, one per temperature sensor.
export const DERATE_PAIRS = [
  { sensor: 'motor', start: 'motorDerateStartC', cutoff: 'motorCutoffC', roles: ['motorDerateStart', 'motorCutoff'] },
  { sensor: 'inverter', start: 'inverterDerateStartC', cutoff: 'inverterCutoffC', roles: ['inverterDerateStart', 'inverterCutoff'] },
  { sensor: 'battery', start: 'batteryDerateStartC', cutoff: 'batteryCutoffC', roles: ['batteryDerateStart', 'batteryCutoff'] }
] as const satisfies readonly { sensor: string, start: ParameterName, cutoff: ParameterName, roles: readonly string[] }[]

export function isParameterName(name: string): name is ParameterName {
  return (PARAMETER_NAMES as readonly string[]).includes(name)
}
