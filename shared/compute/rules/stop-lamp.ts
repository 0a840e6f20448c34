// stop-lamp: UN Regulation No. 13-H para 5.2.22.4 on regen that acts when the accelerator is released.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export const STOP_LAMP_MUST_LIGHT_MS2 = 1.3 // above this the stop-lamp signal shall be generated
export const STOP_LAMP_MUST_NOT_LIGHT_MS2 = 0.7 // at or below this it shall not

export function stopLamp(x: RuleInput): Warning[] {
  const lift = x.figures.liftOffDecelMs2
  if (lift === null || lift <= STOP_LAMP_MUST_NOT_LIGHT_MS2) return []
  if (lift > STOP_LAMP_MUST_LIGHT_MS2) {
    return [warning('stop-lamp', 'caution',
      `Lifting off slows the car at about ${n(lift)} m/s², above 1.3 m/s², so the stop lamps must light when it does (UN Regulation No. 13-H, 5.2.22.4); otherwise drivers behind get no sign that the car is slowing. Wire the controller's brake-light output and check on the road test that the lamps light on lift-off.`,
      lift, STOP_LAMP_MUST_LIGHT_MS2)]
  }
  return [warning('stop-lamp', 'info',
    `Lifting off slows the car at about ${n(lift)} m/s², between 0.7 and 1.3 m/s², where the stop lamps may light but need not (UN Regulation No. 13-H, 5.2.22.4). Decide how the car is wired and note it on the handover sheet.`,
    lift, STOP_LAMP_MUST_NOT_LIGHT_MS2)]
}
