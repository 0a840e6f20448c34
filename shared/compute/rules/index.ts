// Every safety rule, run in a fixed order; each returns zero or more warnings.
import type { RuleId, Warning } from '../types'
import type { Rule, RuleInput } from './context'
import { creepHold } from './creep-hold'
import { currentLimits } from './current-limits'
import { derateBand } from './derate-band'
import { hillStart } from './hill-start'
import { powerRatio } from './power-ratio'
import { regenGripSnow } from './regen-grip-snow'
import { regenGripWet } from './regen-grip-wet'
import { stopLamp } from './stop-lamp'
import { tyreLoad } from './tyre-load'
import { tyreSpeed } from './tyre-speed'
import { uncheckedWarning } from './needs'

export const rules: Readonly<Record<RuleId, Rule>> = {
  'regen-grip-wet': regenGripWet,
  'regen-grip-snow': regenGripSnow,
  'stop-lamp': stopLamp,
  'power-ratio': powerRatio,
  'tyre-speed': tyreSpeed,
  'tyre-load': tyreLoad,
  'current-limits': currentLimits,
  'hill-start': hillStart,
  'creep-hold': creepHold,
  'derate-band': derateBand
}

// Each rule checks what it can; where a setting it needs is absent it also says it could not be checked.
export function runRules(x: RuleInput): Warning[] {
  return (Object.entries(rules) as [RuleId, Rule][]).flatMap(([id, rule]) => {
    const unchecked = uncheckedWarning(id, x)
    return unchecked ? [...rule(x), unchecked] : rule(x)
  })
}

export { DEFER, type Rule, type RuleInput } from './context'
export { creepHold, currentLimits, derateBand, hillStart, powerRatio, regenGripSnow, regenGripWet, stopLamp, tyreLoad, tyreSpeed }
export { STOP_LAMP_MUST_LIGHT_MS2, STOP_LAMP_MUST_NOT_LIGHT_MS2 } from './stop-lamp'
