// regen-grip-wet: lift-off (and brake) regen against the driven axle's grip on a wet road.
import type { Warning } from '../types'
import type { RuleInput } from './context'
import { regenGripWarnings } from './regen-grip'

export function regenGripWet(x: RuleInput): Warning[] {
  return regenGripWarnings(x, 'wet')
}
