// Fleet search conditions in the page's address, so a search can be shared: one `c` per condition,
// "field~op~value", a list joined with "|".
import { searchFields, type SearchCondition, type SearchOp } from '~~/shared/schemas/fleet-search'

const isNumberField = (field: string) => field.startsWith('unit.') || searchFields.find(f => f.key === field)?.kind === 'number'

export function conditionsToQuery(conditions: SearchCondition[]): string[] {
  return conditions.map(c => `${c.field}~${c.op}~${Array.isArray(c.value) ? c.value.join('|') : c.value}`)
}

export function conditionsFromQuery(q: unknown): SearchCondition[] {
  const list = (Array.isArray(q) ? q : q ? [q] : []).filter((x): x is string => typeof x === 'string').slice(0, 12)
  return list.flatMap((s) => {
    const [field, op, raw] = s.split('~')
    if (!field || !op || raw === undefined) return []
    const parse = (x: string) => (isNumberField(field) ? Number(x) : x)
    const value = op === 'in' ? raw.split('|').map(parse) : parse(raw)
    return [{ field, op: op as SearchOp, value }]
  })
}
