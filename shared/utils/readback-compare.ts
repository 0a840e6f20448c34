import type { ReadbackDifference } from '../schemas/readback'

// Compares what the controller holds with the signed-off version. Two values are the same setting when
// they differ by less than half the parameter's step (the controller stores values on its step grid);
// a parameter missing from either side is a difference.
export function compareReadback(expected: Record<string, number>, found: Record<string, number>, steps: Record<string, number> = {}): ReadbackDifference[] {
  const names = [...new Set([...Object.keys(expected), ...Object.keys(found)])].sort()
  const differences: ReadbackDifference[] = []
  for (const parameter of names) {
    const e = Object.hasOwn(expected, parameter) ? expected[parameter]! : null
    const f = Object.hasOwn(found, parameter) ? found[parameter]! : null
    if (e === null || f === null) { differences.push({ parameter, expected: e, found: f }); continue }
    const step = steps[parameter]
    const tolerance = step && step > 0 ? step / 2 : Math.max(1e-9, Math.abs(e) * 1e-9)
    if (!(Math.abs(e - f) < tolerance)) differences.push({ parameter, expected: e, found: f })
  }
  return differences
}
