import type { Figures, Warning } from '../../../shared/compute/types'
import { FIGURE_ROWS } from '../../../shared/schemas/figure-rows'
import type { FigureDiffRow, WarningDiff } from '../../../shared/schemas/profile-views'

// Twelve significant figures: enough for any workshop figure, and 0.1 + 0.2 reads as 0.3.
const tidy = (x: number) => Number(x.toPrecision(12))

export function numericChange(before: unknown, after: unknown): { change: number | null, changePct: number | null } {
  if (typeof before !== 'number' || typeof after !== 'number') return { change: null, changePct: null }
  const change = tidy(after - before)
  return { change, changePct: before === 0 ? null : tidy((change / Math.abs(before)) * 100) }
}

function same(a: number | string | null, b: number | string | null) {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))
  return a === b
}

export function figureDiff(a: Figures, b: Figures): FigureDiffRow[] {
  return FIGURE_ROWS.map(({ name, label, unit, read }) => {
    const before = read(a)
    const after = read(b)
    return { name, label, unit, before, after, ...numericChange(before, after), changed: !same(before, after) }
  })
}

// A rule can warn more than once (lift-off and brake regen); the wording without its numbers tells them apart.
const gist = (w: Warning) => `${w.rule}|${w.message.replace(/[\d.,]+/g, '#')}`

// The warnings that came, those that went, and those on both sides (perhaps at another severity or value):
// first matched by rule and wording, then what is left of the same rule in order.
export function warningDiff(a: Warning[], b: Warning[]): WarningDiff {
  const left = [...a]
  const kept: WarningDiff['kept'] = []
  const appeared: Warning[] = []
  const unmatched: Warning[] = []
  for (const w of b) {
    const i = left.findIndex(x => gist(x) === gist(w))
    if (i >= 0) kept.push({ before: left.splice(i, 1)[0]!, after: w })
    else unmatched.push(w)
  }
  for (const w of unmatched) {
    const i = left.findIndex(x => x.rule === w.rule)
    if (i >= 0) kept.push({ before: left.splice(i, 1)[0]!, after: w })
    else appeared.push(w)
  }
  return { appeared, disappeared: left, kept }
}
