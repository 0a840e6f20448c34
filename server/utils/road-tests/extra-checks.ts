// The workshop's own checks in a road test's body: each one known for this car, every required one there,
// a number check with its measured value (docs/road-tests.md).
import { mandatoryCheckKeys, type RoadTestCreate } from '../../../shared/schemas/road-test'
import type { WorkshopCheck } from '../../../shared/schemas/workshop-checks'

type Field = { path: string, message: string }

export function extraCheckProblems(defs: WorkshopCheck[], checks: RoadTestCreate['checks']): Field[] {
  const byKey = new Map(defs.map(d => [d.key, d]))
  const out: Field[] = []
  checks.forEach((c, i) => {
    if ((mandatoryCheckKeys as readonly string[]).includes(c.key)) return
    const def = byKey.get(c.key)
    if (!def) return void out.push({ path: `checks.${i}.key`, message: `"${c.key}" is not one of this workshop's checks for this car` })
    const value = (c.values as { value?: number | null }).value
    if (def.record === 'number' && c.verdict !== 'not-tested' && (value === undefined || value === null)) {
      out.push({ path: `checks.${i}.values.value`, message: `${def.label}: the measured value is needed` })
    }
    if (def.record === 'pass-fail' && value !== undefined && value !== null) out.push({ path: `checks.${i}.values.value`, message: `${def.label} is recorded as pass or fail, without a number` })
  })
  for (const def of defs) {
    if (def.required && !checks.some(c => c.key === def.key)) out.push({ path: 'checks', message: `The "${def.label}" check is required` })
  }
  return out
}

export function requireExtraChecks(defs: WorkshopCheck[], checks: RoadTestCreate['checks']): void {
  const fields = extraCheckProblems(defs, checks)
  if (fields.length) throw createError({ statusCode: 400, message: fields.map(f => f.message).join('; '), data: { fields } })
}
