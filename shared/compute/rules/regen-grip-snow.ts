// regen-grip-snow: lift-off (and brake) regen against the driven axle's grip on snow.
import type { Warning } from '../types'
import type { RuleInput } from './context'
import { regenGripWarnings } from './regen-grip'

export function regenGripSnow(x: RuleInput): Warning[] {
  return regenGripWarnings(x, 'snow')
}
