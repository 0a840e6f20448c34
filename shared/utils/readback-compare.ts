import type { LooseProperty } from '../compute/setting-kinds'
import { curveAxes, finite } from '../compute/setting-kinds'
import type { ReadbackDifference } from '../schemas/readback'
import { settingLabel, settingValueWords } from './setting-words'

// Two numbers are the same setting when they differ by less than half the step (the controller stores values
// on its step grid), or by a rounding error where there is no step.
function sameNumber(e: number, f: number, step: unknown): boolean {
  const tolerance = finite(step) && step > 0 ? step / 2 : Math.max(1e-9, Math.abs(e) * 1e-9)
  return Math.abs(e - f) < tolerance
}

function sameValue(e: unknown, f: unknown, p: LooseProperty | undefined): boolean {
  if (typeof e === 'number' && typeof f === 'number') return sameNumber(e, f, p?.multipleOf)
  if (Array.isArray(e) && Array.isArray(f)) {
    const axes = p ? curveAxes(p) : { x: {}, y: {} }
    return e.length === f.length && e.every((pt, i) => {
      const a = pt as { x: unknown, y: unknown }
      const b = f[i] as { x: unknown, y: unknown } | null
      return !!b && finite(a.x) && finite(b.x) && finite(a.y) && finite(b.y) && sameNumber(a.x, b.x, axes.x.multipleOf) && sameNumber(a.y, b.y, axes.y.multipleOf)
    })
  }
  return e === f
}

// Compares what the controller holds with the signed-off version, setting by setting, and says each
// difference in words with the schema's title and units; a setting missing from either side is a difference.
export function compareReadback(expected: Record<string, unknown>, found: Record<string, unknown>, props: Record<string, LooseProperty> = {}): ReadbackDifference[] {
  const names = [...new Set([...Object.keys(expected), ...Object.keys(found)])].sort()
  const differences: ReadbackDifference[] = []
  for (const parameter of names) {
    const e = Object.hasOwn(expected, parameter) ? expected[parameter] ?? null : null
    const f = Object.hasOwn(found, parameter) ? found[parameter] ?? null : null
    const p = Object.hasOwn(props, parameter) ? props[parameter] : undefined
    if (e !== null && f !== null && sameValue(e, f, p)) continue
    differences.push({
      parameter, expected: e, found: f, label: settingLabel(p, parameter),
      expectedWords: e === null ? 'not set' : settingValueWords(p, e), foundWords: f === null ? 'not read' : settingValueWords(p, f)
    })
  }
  return differences
}

// A difference stored before differences carried their words, said in words again from the schema.
export function withWords(d: Pick<ReadbackDifference, 'parameter' | 'expected' | 'found'>, props: Record<string, LooseProperty> = {}): ReadbackDifference {
  const p = Object.hasOwn(props, d.parameter) ? props[d.parameter] : undefined
  const e = d.expected ?? null
  const f = d.found ?? null
  return {
    parameter: d.parameter, expected: e, found: f, label: settingLabel(p, d.parameter),
    expectedWords: e === null ? 'not set' : settingValueWords(p, e), foundWords: f === null ? 'not read' : settingValueWords(p, f)
  }
}
