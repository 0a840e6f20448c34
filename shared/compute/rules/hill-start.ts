// hill-start: the steepest gradient the car can pull away on, against the workshop's minimum.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function hillStart(x: RuleInput): Warning[] {
  const grade = x.figures.maxStartGradePct
  const min = x.settings.minStartGradePct
  if (grade === null || grade >= min) return []
  const remedy = x.figures.startGradeLimitedBy === 'traction'
    ? 'The driven wheels spin before the car moves, so more torque will not help: it needs more weight over the driven axle or grippier tyres.'
    : 'Raise the torque cap or fit lower gearing.'
  return [warning('hill-start', 'caution',
    `From rest the car can pull away on a gradient of about ${n(grade, 2)} % at most, less than the workshop's ${n(min)} % minimum: on a steep hill, ramp or trailer it may not move off, or may roll back. ${remedy}`,
    grade, min)]
}
