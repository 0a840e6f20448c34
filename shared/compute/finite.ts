// The last guard: no NaN or Infinity leaves an evaluation; such a figure becomes null with a reason.
import type { Figures, NullReasons } from './types'

const NOT_FINITE = 'Cannot be worked out from these values (the result is not a finite number)'

export function scrubFigures(figures: Figures, reasons: NullReasons): void {
  const f = figures as unknown as Record<string, unknown>
  for (const [name, value] of Object.entries(f)) {
    if (typeof value === 'number' && !Number.isFinite(value)) {
      f[name] = null
      reasons[name as keyof Figures] ??= NOT_FINITE
    } else if (value !== null && typeof value === 'object') {
      const inner = value as Record<string, unknown>
      for (const [k, v] of Object.entries(inner)) {
        if (typeof v === 'number' && !Number.isFinite(v)) {
          inner[k] = null
          reasons[name as keyof Figures] ??= NOT_FINITE
        }
      }
    }
  }
}
