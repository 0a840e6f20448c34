// Each searchable field as SQL written here, never from the request: the request only picks from this list
// (shared/schemas/fleet-search.ts), and every value it gives is bound as a parameter (docs/fleet.md).
import { searchFields, UNIT_SETTING, type SearchCondition, type SearchField } from '../../../shared/schemas/fleet-search'

const byKey = new Map(searchFields.map(f => [f.key, f]))
const figureColumn: Record<string, string> = {
  liftOffOverSnowGripMs2: 'liftOffOverSnowGripMs2', liftOffOverWetGripMs2: 'liftOffOverWetGripMs2', liftOffDecelMs2: 'liftOffDecelMs2', brakeRegenDecelMs2: 'brakeRegenDecelMs2',
  gripWetMs2: 'gripWetMs2', gripSnowMs2: 'gripSnowMs2', zeroTo100S: 'zeroTo100S', topSpeedKph: 'topSpeedKph', maxStartGradePct: 'maxStartGradePct',
  powerRatioToOriginal: 'powerRatioToOriginal', peakDischargeCurrentA: 'peakDischargeCurrentA', dangerCount: 'dangerCount'
}
const carColumn: Record<string, string> = { make: 'v.make', model: 'v.model', year: 'v.year', status: 'v.status', driveUnit: 'pl.key' }

export interface FieldSql { sql: string, kind: SearchField['kind'] | 'warning', unit?: { key: string, setting: string } }

const field400 = (field: string) => createError({ statusCode: 400, message: `"${field}" is not a field fleet search knows.`, data: { fields: [{ path: 'field', message: 'Not a searchable field' }] } })

export function fieldSql(key: string): FieldSql {
  const unit = UNIT_SETTING.exec(key)
  if (unit) {
    // The unit's key and the setting's name are bound (see bound below); search-units.ts checks both exist.
    return { sql: `(CASE WHEN pl.key = :unit_KEY AND jsonb_typeof(e.settings->CAST(:unit_NAME AS text)) = 'number' THEN (e.settings->>CAST(:unit_NAME AS text))::double precision END)`, kind: 'number', unit: { key: unit[1]!, setting: unit[2]! } }
  }
  const f = byKey.get(key)
  if (!f) throw field400(key)
  const [group, name] = key.split('.') as [string, string | undefined]
  if (group === 'warning') return { sql: 'e.warnings', kind: 'warning' }
  if (group === 'car') return { sql: carColumn[name!]!, kind: f.kind }
  // Typed columns (migrations/20261203-7101-fleet-search-columns.ts): the spec's facts computed by PostgreSQL
  // from the spec, the settings by role in their role's own unit, written with the figures.
  if (group === 'spec') return { sql: `v."spec${name![0]!.toUpperCase()}${name!.slice(1)}"`, kind: f.kind }
  if (group === 'setting') return { sql: `e."${name}"`, kind: 'number' }
  if (group === 'figure') return { sql: `e."${figureColumn[name!]}"`, kind: 'number' }
  throw field400(key)
}

// The field's SQL with its unit's key and setting name bound under names of the caller's (c0_unit …).
export function bound(f: FieldSql, name: string, replacements: Record<string, unknown>): string {
  if (!f.unit) return f.sql
  replacements[`${name}_unit`] = f.unit.key
  replacements[`${name}_name`] = f.unit.setting
  return f.sql.replaceAll(':unit_KEY', `:${name}_unit`).replaceAll(':unit_NAME', `:${name}_name`)
}

const compare = { eq: '=', ne: '<>', lt: '<', le: '<=', gt: '>', ge: '>=' } as const

// One condition as SQL with its values bound under names of its own (c0, c1 …).
export function conditionSql(c: SearchCondition, i: number, replacements: Record<string, unknown>): string {
  const f = fieldSql(c.field)
  const name = `c${i}`
  const sql = bound(f, name, replacements)
  const list = Array.isArray(c.value) ? c.value : [c.value]
  const bad = (message: string) => createError({ statusCode: 400, message, data: { fields: [{ path: `conditions.${i}`, message }] } })
  if (f.kind === 'number' && list.some(v => typeof v !== 'number')) throw bad('This field needs a number.')
  if (f.kind !== 'number' && list.some(v => typeof v !== 'string')) throw bad('This field needs words, not a number.')
  if (c.op === 'in' ? !Array.isArray(c.value) : Array.isArray(c.value)) throw bad(c.op === 'in' ? '"is one of" needs a list.' : 'Only "is one of" takes a list.')
  if (f.kind !== 'number' && !['eq', 'ne', 'in'].includes(c.op)) throw bad('Words can only be matched: is, is not, or is one of.')
  if (f.kind === 'warning') {
    replacements[name] = c.op === 'in' ? list : list[0]
    if (c.op === 'in') return `e.warnings && CAST(:${name} AS text[])`
    return c.op === 'eq' ? `:${name} = ANY(e.warnings)` : `NOT (:${name} = ANY(e.warnings))`
  }
  replacements[name] = c.op === 'in' ? list : list[0]
  if (c.op === 'in') return `${sql} = ANY(:${name})` // one array parameter (selectRows)
  return `${sql} ${compare[c.op]} :${name}`
}
