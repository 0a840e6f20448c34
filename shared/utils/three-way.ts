// Rebasing a car's settings onto a newer kit baseline, setting by setting (docs/kits.md): the car's own
// deviation is kept where the baseline did not change that setting, the baseline's change is taken where
// the car had not deviated, and where both changed it differently the choice is the tuner's.
import type { SettingValue } from '../compute/setting-kinds'
import { canonicalJson } from './canonical-json'

export type Settings = Record<string, SettingValue>

export interface MergeRow {
  name: string
  base: SettingValue | null
  car: SettingValue | null
  kit: SettingValue | null
  merged: SettingValue | null
  conflict: boolean
  source: 'same' | 'car' | 'kit' | 'both'
}

const value = (s: Settings, name: string): SettingValue | null => s[name] ?? null
// Switches, choices and curves as well as numbers: the same when their canonical JSON is.
const same = (a: SettingValue | null, b: SettingValue | null) => canonicalJson(a) === canonicalJson(b)

export function settingsThatDiffer(a: Settings, b: Settings): string[] {
  return [...new Set([...Object.keys(a), ...Object.keys(b)])].filter(n => !same(value(a, n), value(b, n))).sort()
}

// base: the baseline the car stood on; car: the car's settings; kit: the newer baseline.
export function mergeThreeWay(base: Settings, car: Settings, kit: Settings): MergeRow[] {
  const names = [...new Set([...Object.keys(base), ...Object.keys(car), ...Object.keys(kit)])].sort()
  return names.map((name) => {
    const [b, c, k] = [value(base, name), value(car, name), value(kit, name)]
    if (same(c, k)) return { name, base: b, car: c, kit: k, merged: c, conflict: false, source: same(c, b) ? 'same' : 'both' }
    if (same(k, b)) return { name, base: b, car: c, kit: k, merged: c, conflict: false, source: 'car' }
    if (same(c, b)) return { name, base: b, car: c, kit: k, merged: k, conflict: false, source: 'kit' }
    return { name, base: b, car: c, kit: k, merged: null, conflict: true, source: 'both' }
  })
}

// The merged settings with each conflict settled by the tuner's choice; names of conflicts left unchosen.
export function settleMerge(rows: MergeRow[], choices: Record<string, 'car' | 'kit'>): { parameters: Settings, unresolved: string[] } {
  const parameters: Settings = {}
  const unresolved: string[] = []
  for (const r of rows) {
    const chosen = r.conflict ? (choices[r.name] ? r[choices[r.name]!] : undefined) : r.merged
    if (r.conflict && chosen === undefined) unresolved.push(r.name)
    if (chosen !== undefined && chosen !== null) parameters[r.name] = chosen
  }
  return { parameters, unresolved }
}
