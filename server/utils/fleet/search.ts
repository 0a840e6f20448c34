// Fleet search over the cars' on-car evaluations, keyset-paged (docs/fleet.md).
import { QueryTypes } from 'sequelize'
import type { SignedIn } from '../guards/guards'
import type { SearchAnswer, SearchItem, SearchRequest } from '../../../shared/schemas/fleet-search'
import { useDatabase } from '../database/db'
import { conditionSql, fieldSql } from './search-sql'

interface Cursor { v: string | null, id: number }
const encode = (c: Cursor) => Buffer.from(JSON.stringify(c)).toString('base64url')
function decode(s: string): Cursor {
  try {
    const c = JSON.parse(Buffer.from(s, 'base64url').toString()) as Cursor
    if (Number.isInteger(c.id) && (c.v === null || typeof c.v === 'string')) return c
  } catch { /* answered below */ }
  throw createError({ statusCode: 400, message: 'That page marker is not one this search gave.', data: { fields: [{ path: 'cursor', message: 'Not a page marker' }] } })
}

const FROM = `FROM on_car_evaluations e JOIN vehicles v ON v.id = e."vehicleId" JOIN platforms pl ON pl.id = v."platformId"`

export async function searchFleet(user: SignedIn, q: SearchRequest): Promise<SearchAnswer> {
  const replacements: Record<string, unknown> = { workshopId: user.workshopId, limit: q.limit + 1 }
  const where = ['e."workshopId" = :workshopId', ...q.conditions.map((c, i) => conditionSql(c, i, replacements))]
  const sortField = q.sort ? fieldSql(q.sort.field) : { sql: 'v."stockRef"', kind: 'text' as const }
  if (sortField.kind === 'warning' || sortField.unitKey) throw createError({ statusCode: 400, message: 'Sort by a figure, a setting or a fact of the car.', data: { fields: [{ path: 'sort.field', message: 'Cannot sort by this' }] } })
  const desc = q.sort?.dir === 'desc'
  // Missing values sort last either way; the key is text-cast so one cursor form serves every field.
  const key = sortField.kind === 'number' ? `COALESCE(${sortField.sql}, '${desc ? '-' : ''}Infinity')` : `COALESCE(${sortField.sql}::text, '')`
  const cast = sortField.kind === 'number' ? 'double precision' : 'text'
  const paged = [...where]
  if (q.cursor) {
    const c = decode(q.cursor)
    replacements.cursorValue = c.v ?? ''
    replacements.cursorId = c.id
    paged.push(`(${key}, e."profileId") ${desc ? '<' : '>'} (CAST(:cursorValue AS ${cast}), :cursorId)`)
  }
  const shown = [...new Set(q.conditions.map(c => c.field))].filter(f => f !== 'warning')
  const valueCols = shown.map((f, i) => { const s = fieldSql(f); if (s.unitKey) replacements[`v${i}_unit`] = s.unitKey; return `${s.sql.replace(':unit_KEY', `:v${i}_unit`)} AS "v${i}"` })
  const db = useDatabase()
  const [rows, [count]] = await Promise.all([
    db.query<Record<string, unknown>>(
      `SELECT e."profileId", v.id AS "vehicleId", v."stockRef", v.make, v.model, v.year, v.status, pl.name AS "driveUnit", p.name AS "profileName",
              e."versionId", pv."versionNo", e.warnings, (${key})::text AS "sortKey"${valueCols.length ? `, ${valueCols.join(', ')}` : ''}
         ${FROM} JOIN profiles p ON p.id = e."profileId" JOIN profile_versions pv ON pv.id = e."versionId"
        WHERE ${paged.join(' AND ')} ORDER BY ${key} ${desc ? 'DESC' : 'ASC'}, e."profileId" ${desc ? 'DESC' : 'ASC'} LIMIT :limit`,
      { replacements, type: QueryTypes.SELECT }),
    db.query<{ n: string }>(`SELECT count(*) AS n ${FROM} WHERE ${where.join(' AND ')}`, { replacements, type: QueryTypes.SELECT })
  ])
  const more = rows.length > q.limit
  const page = rows.slice(0, q.limit)
  const items: SearchItem[] = page.map(r => ({
    vehicleId: r.vehicleId as number, stockRef: r.stockRef as string, make: r.make as string, model: r.model as string, year: r.year as number,
    status: r.status as string, driveUnit: r.driveUnit as string, profileName: r.profileName as string, versionId: r.versionId as number,
    versionNo: r.versionNo as number, warnings: r.warnings as string[],
    values: Object.fromEntries(shown.map((f, i) => [f, r[`v${i}`] as number | string | null]))
  }))
  const last = page.at(-1)
  return { items, total: Number(count!.n), nextCursor: more && last ? encode({ v: last.sortKey as string, id: last.profileId as number }) : null }
}
