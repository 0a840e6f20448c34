// tyre-load: the load each tyre carries at test mass (static axle share / 2) against its load rating.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function tyreLoad(x: RuleInput): Warning[] {
  const out: Warning[] = []
  for (const axle of ['front', 'rear'] as const) {
    const load = x.figures.tyreLoadPerTyreKg[axle]
    const capacity = x.figures.tyreLoadCapacityKg[axle]
    if (load === null || capacity === null) continue
    const cautionAt = x.settings.tyreLoadCautionFraction * capacity
    if (load > capacity) {
      out.push(warning('tyre-load', 'danger',
        `Loaded to test mass, each ${axle} tyre carries about ${n(load)} kg, more than its ${n(capacity)} kg load rating: it can overheat, wear fast or fail, and the car will feel vague. Fit tyres with a higher load index, or take weight off that axle.`,
        load, capacity))
    } else if (load > cautionAt) {
      out.push(warning('tyre-load', 'caution',
        `Loaded to test mass, each ${axle} tyre carries about ${n(load)} kg, over ${n(100 * x.settings.tyreLoadCautionFraction)} % of its ${n(capacity)} kg load rating: little margin left for luggage, a passenger or a hot day. Consider tyres with a higher load index.`,
        load, cautionAt))
    }
  }
  return out
}
