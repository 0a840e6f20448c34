// Which of a car's warnings now were not raised when its settings were signed off (docs/fleet.md). A warning
// counts as raised before if the same rule warned then at the same severity or worse, once per warning.
export type Severity = 'info' | 'caution' | 'danger'
export interface WarningLike { rule: string, severity: Severity, message?: string }

export const severityRank: Record<Severity, number> = { info: 1, caution: 2, danger: 3 }

export function newWarnings<W extends WarningLike>(before: WarningLike[], now: W[]): W[] {
  const left = [...before]
  const byWorst = [...now].sort((a, b) => severityRank[b.severity] - severityRank[a.severity])
  const fresh: W[] = []
  for (const w of byWorst) {
    const i = left.findIndex(b => b.rule === w.rule && severityRank[b.severity] >= severityRank[w.severity])
    if (i >= 0) left.splice(i, 1)
    else fresh.push(w)
  }
  return fresh
}

export const worstRank = (list: WarningLike[]) => Math.max(0, ...list.map(w => severityRank[w.severity]))
