// creep-hold: creep torque that is switched on but cannot hold the car on a modest slope.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function creepHold(x: RuleInput): Warning[] {
  const grade = x.figures.creepHoldGradePct
  const min = x.settings.minCreepHoldGradePct
  const creep = x.parameters.creepTorqueNm
  if (creep === null || creep <= 0 || grade === null || grade >= min) return []
  return [warning('creep-hold', 'caution',
    `With creep on, the car can only hold a slope of about ${n(grade, 2)} %, less than the workshop's ${n(min)} % minimum: on a driveway, ramp or in queuing traffic on a hill it will roll back unless the driver holds it on the brake. Raise the creep torque, or tell the client creep will not hold the car.`,
    grade, min)]
}
