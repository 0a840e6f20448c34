// Shared by regen-grip-wet and regen-grip-snow: regen on the driven axle against what it can grip.
import type { Surface } from '../settings'
import type { Warning } from '../types'
import { drivenWheels, n, warning, type RuleInput } from './context'

type GripSurface = Exclude<Surface, 'dry'>
const ROAD: Record<GripSurface, string> = { wet: 'On a wet road', snow: 'On snow' }
const BEND: Record<GripSurface, string> = { wet: 'on a wet bend', snow: 'on a snowy bend' }

export function regenGripWarnings(x: RuleInput, surface: GripSurface): Warning[] {
  const rule = surface === 'wet' ? 'regen-grip-wet' : 'regen-grip-snow'
  const limit = x.figures.regenGripLimitMs2[surface]
  if (limit === null) return []
  const { wheels, alone, lockup } = drivenWheels(x.spec.drivenAxle)
  const cautionAt = x.settings.regenGripCautionFraction * limit
  const out: Warning[] = []
  const lift = x.figures.liftOffDecelMs2
  if (lift !== null && lift > cautionAt) {
    const over = lift > limit
    const how = over ? `more than the ${n(limit)} m/s² they can grip` : `close to the ${n(limit)} m/s² they can grip`
    out.push(warning(rule, over ? 'danger' : 'caution',
      `${ROAD[surface]}, lifting off the accelerator brakes ${alone} at about ${n(lift)} m/s², ${how}: ${BEND[surface]} ${lockup}. Lower the lift-off regen until it sits well below the grip limit.`,
      lift, over ? limit : cautionAt))
  }
  const brake = x.figures.brakeRegenDecelMs2
  if (brake !== null && brake > limit) {
    out.push(warning(rule, 'danger',
      `${ROAD[surface]}, brake regen alone asks ${wheels} for about ${n(brake)} m/s², more than the ${n(limit)} m/s² they can grip, before the friction brakes add their share: under braking ${BEND[surface]} ${lockup}. Lower the brake regen.`,
      brake, limit))
  }
  return out
}
