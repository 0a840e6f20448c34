// tyre-speed: the tyres' speed rating against the car's top speed.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function tyreSpeed(x: RuleInput): Warning[] {
  const top = x.figures.topSpeedKph
  const rating = x.figures.tyreSpeedRatingKph
  if (top === null || rating === null || top <= rating) return []
  return [warning('tyre-speed', 'danger',
    `The car can reach about ${n(top)} km/h but its tyres are rated for ${n(rating)} km/h: held at that speed a tyre can overheat and fail. Lower the speed limit to the tyres' rating, or fit tyres with a higher speed symbol.`,
    top, rating)]
}
