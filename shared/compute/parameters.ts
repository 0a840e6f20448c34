// The controller settings a profile version holds (docs/computation.md#parameters); each platform's schema gives their ranges.

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
  { sensor: 'motor', start: 'motorDerateStartC', cutoff: 'motorCutoffC' },
  { sensor: 'inverter', start: 'inverterDerateStartC', cutoff: 'inverterCutoffC' },
  { sensor: 'battery', start: 'batteryDerateStartC', cutoff: 'batteryCutoffC' }
] as const satisfies readonly { sensor: string, start: ParameterName, cutoff: ParameterName }[]

export function isParameterName(name: string): name is ParameterName {
  return (PARAMETER_NAMES as readonly string[]).includes(name)
}
