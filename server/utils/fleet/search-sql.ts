// Each searchable field as SQL written here, never from the request: the request only picks from this list
// (shared/schemas/fleet-search.ts), and every value it gives is bound as a parameter (docs/fleet.md).
import { PARAMETER_NAMES } from '../../../shared/compute/parameters'
import { searchFields, UNIT_SETTING, type SearchCondition, type SearchField } from '../../../shared/schemas/fleet-search'

const byKey = new Map(searchFields.map(f => [f.key, f]))
const specText = new Set(['drivenAxle'])
const figureColumn: Record<string, string> = {
  liftOffOverSnowGripMs2: 'liftOffOverSnowGripMs2', liftOffOverWetGripMs2: 'liftOffOverWetGripMs2', liftOffDecelMs2: 'liftOffDecelMs2', brakeRegenDecelMs2: 'brakeRegenDecelMs2',
  gripWetMs2: 'gripWetMs2', gripSnowMs2: 'gripSnowMs2', zeroTo100S: 'zeroTo100S', topSpeedKph: 'topSpeedKph', maxStartGradePct: 'maxStartGradePct',
  powerRatioToOriginal: 'powerRatioToOriginal', peakDischargeCurrentA: 'peakDischargeCurrentA', dangerCount: 'dangerCount'
}
const carColumn: Record<string, string> = { make: 'v.make', model: 'v.model', year: 'v.year', status: 'v.status', driveUnit: 'pl.key' }

export interface FieldSql { sql: string, kind: SearchField['kind'] | 'warning', unitKey?: string }

const field400 = (field: string) => createError({ statusCode: 400, message: `"${field}" is not a field fleet search knows.`, data: { fields: [{ path: 'field', message: 'Not a searchable field' }] } })

export function fieldSql(key: string): FieldSql {
  const unit = UNIT_SETTING.exec(key)
  if (unit && (PARAMETER_NAMES as readonly string[]).includes(unit[2]!)) {
    return { sql: `(CASE WHEN pl.key = :unit_KEY THEN (e.settings->>'${unit[2]}')::double precision END)`, kind: 'number', unitKey: unit[1] }
  }
  const f = byKey.get(key)
  if (!f) throw field400(key)
  const [group, name] = key.split('.') as [string, string | undefined]
  if (group === 'warning') return { sql: 'e.warnings', kind: 'warning' }
  if (group === 'car') return { sql: carColumn[name!]!, kind: f.kind }
  if (group === 'spec') return { sql: specText.has(name!) ? `(v.spec->>'${name}')` : `(v.spec->>'${name}')::double precision`, kind: f.kind }
  if (group === 'setting') return { sql: `(e.settings->>'${name}')::double precision`, kind: 'number' }
  if (group === 'figure') return { sql: `e."${figureColumn[name!]}"`, kind: 'number' }
  throw field400(key)
}

const compare = { eq: '=', ne: '<>', lt: '<', le: '<=', gt: '>', ge: '>=' } as const

// One condition as SQL with its values bound under names of its own (c0, c1 …).
export function conditionSql(c: SearchCondition, i: number, replacements: Record<string, unknown>): string {
  const f = fieldSql(c.field)
  const name = `c${i}`
  const sql = f.unitKey ? f.sql.replace(':unit_KEY', `:${name}_unit`) : f.sql
  if (f.unitKey) replacements[`${name}_unit`] = f.unitKey
  const list = Array.isArray(c.value) ? c.value : [c.value]
  const bad = (message: string) => createError({ statusCode: 400, message, data: { fields: [{ path: `conditions.${i}`, message }] } })
  if (f.kind === 'number' && list.some(v => typeof v !== 'number')) throw bad('This field needs a number.')
  if (f.kind !== 'number' && list.some(v => typeof v !== 'string')) throw bad('This field needs words, not a number.')
  if (c.op === 'in' ? !Array.isArray(c.value) : Array.isArray(c.value)) throw bad(c.op === 'in' ? '"is one of" needs a list.' : 'Only "is one of" takes a list.')
  if (f.kind !== 'number' && !['eq', 'ne', 'in'].includes(c.op)) throw bad('Words can only be matched: is, is not, or is one of.')
  if (f.kind === 'warning') {
    replacements[name] = c.op === 'in' ? list : list[0]
    if (c.op === 'in') return `e.warnings && CAST(ARRAY[:${name}] AS text[])`
    return c.op === 'eq' ? `:${name} = ANY(e.warnings)` : `NOT (:${name} = ANY(e.warnings))`
  }
  replacements[name] = c.op === 'in' ? list : list[0]
  if (c.op === 'in') return `${sql} IN (:${name})`
  return `${sql} ${compare[c.op]} :${name}`
}
