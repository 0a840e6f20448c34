// A rule that needs a setting the controller lacks is not guessed: it says it could not be checked, as a
// caution that the road test must cover it (docs/computation.md, "Roles").
import type { ParameterName } from '../parameters'
import { absentReason } from '../role-needs'
import type { RuleId, Warning } from '../types'
import { DEFER, type RuleInput } from './context'

const LIFT_OFF: ParameterName[] = ['regenTorqueLimitNm', 'liftOffRegenPct', 'batteryChargeLimitA']
const REGEN: ParameterName[] = [...LIFT_OFF, 'brakeRegenPct']
const TEMPERATURES: ParameterName[] = ['motorDerateStartC', 'motorCutoffC', 'inverterDerateStartC', 'inverterCutoffC', 'batteryDerateStartC', 'batteryCutoffC']

export const RULE_NEEDS: Readonly<Record<RuleId, { needs: ParameterName[], roadTest: string }>> = {
  'regen-grip-wet': { needs: REGEN, roadTest: 'try lift-off and brake regen on a wet surface, at low speed first' },
  'regen-grip-snow': { needs: REGEN, roadTest: 'judge regen on a slippery surface, or tell the client how it behaves on snow' },
  'stop-lamp': { needs: LIFT_OFF, roadTest: 'measure the lift-off deceleration and check whether the stop lamps light' },
  'power-ratio': { needs: ['powerCapKw'], roadTest: 'measure the peak power and have the brakes and chassis judged against it' },
  'tyre-speed': { needs: ['torqueCapNm', 'powerCapKw', 'speedLimitKph'], roadTest: 'confirm the top speed stays within the tyres\' speed rating' },
  'tyre-load': { needs: [], roadTest: '' },
  'current-limits': { needs: ['batteryDischargeLimitA', 'batteryChargeLimitA', 'powerCapKw'], roadTest: 'read the peak battery currents from the log against the pack\'s ratings' },
  'hill-start': { needs: ['torqueCapNm'], roadTest: 'start on the steepest hill the car will meet' },
  'creep-hold': { needs: ['creepTorqueNm'], roadTest: 'see whether the car holds or rolls back on a slope with the pedal up' },
  'derate-band': { needs: TEMPERATURES, roadTest: 'watch how power fades during the thermal soak' }
}

export function uncheckedWarning(rule: RuleId, x: RuleInput): Warning | null {
  const { needs, roadTest } = RULE_NEEDS[rule]
  const absent = needs.filter(f => x.parameters[f] === null)
  if (absent.length === 0) return null
  const reasons = [...new Set(absent.map(f => absentReason(f, x.missing ?? [])))]
  return {
    rule,
    severity: 'caution',
    message: `Could not be checked: ${reasons.join('; ')}. The road test must cover it: ${roadTest}. ${DEFER}`,
    value: null,
    limit: null,
    unchecked: true
  }
}
