// The order a tuner works through a controller's settings; a schema's extra settings go under "Other".
import type { ParameterName } from '~~/shared/compute/parameters'

export interface ParameterGroup { id: string, title: string, names: readonly ParameterName[] }

export const parameterGroups: readonly ParameterGroup[] = [
  { id: 'drive', title: 'Drive', names: ['powerCapKw', 'torqueCapNm', 'throttleProgression', 'speedLimitKph', 'reverseSpeedLimitKph'] },
  { id: 'regen', title: 'Regenerative braking', names: ['regenTorqueLimitNm', 'liftOffRegenPct', 'brakeRegenPct'] },
  { id: 'creep', title: 'Creep', names: ['creepTorqueNm', 'creepSpeedKph'] },
  { id: 'currents', title: 'Battery currents', names: ['batteryDischargeLimitA', 'batteryChargeLimitA'] },
  { id: 'thermal', title: 'Thermal derating', names: ['motorDerateStartC', 'motorCutoffC', 'inverterDerateStartC', 'inverterCutoffC', 'batteryDerateStartC', 'batteryCutoffC'] }
]
