// Fleet search over the cars' on-car evaluations, keyset-paged (docs/fleet.md). One statement: the
// conditions run once over typed columns, the total is counted from those matches, and only the page's
// cars are joined to their names, profiles and versions.
import type { SignedIn } from '../guards/guards'
import { resultFields, type SearchAnswer, type SearchItem, type SearchRequest } from '../../../shared/schemas/fleet-search'
import { selectRows } from '../database/db'
import { bound, conditionSql, fieldSql } from './search-sql'
import { unitSettingsOf } from './search-units'

interface Cursor { v: string | null, id: number }
const encode = (c: Cursor) => Buffer.from(JSON.stringify(c)).toString('base64url')
const cursor400 = () => createError({ statusCode: 400, message: 'That page marker is not one this search gave.', data: { fields: [{ path: 'cursor', message: 'Not a page marker' }] } })
function decode(s: string, numeric: boolean): Cursor {
  let c: Cursor
  try {
    c = JSON.parse(Buffer.from(s, 'base64url').toString()) as Cursor
  } catch {
    throw cursor400()
  }
  const okValue = c?.v === null || (typeof c?.v === 'string' && c.v.length <= 200 && (!numeric || /^-?(?:Infinity|\d+(?:\.\d+)?(?:e[+-]?\d+)?)$/.test(c.v)))
  if (Number.isInteger(c?.id) && okValue) return c
  throw cursor400()
}

interface Row { total: string, profileId: number | null, vehicleId: number, stockRef: string, make: string, model: string, year: number, status: string, driveUnit: string, profileName: string, versionId: number, versionNo: number, driftedAt: Date | null, warnings: string[], sortKey: string, [value: string]: unknown }

export async function searchFleet(user: SignedIn, q: SearchRequest): Promise<SearchAnswer> {
  await unitSettingsOf(user, q.conditions.map(c => c.field)) // a setting named within a unit must be one of its number settings
  const replacements: Record<string, unknown> = { workshopId: user.workshopId, limit: q.limit + 1 }
  const where = ['e."workshopId" = :workshopId', ...q.conditions.map((c, i) => conditionSql(c, i, replacements))]
  const sortField = q.sort ? fieldSql(q.sort.field) : { sql: 'v."stockRef"', kind: 'text' as const }
  if (sortField.kind === 'warning' || sortField.unit) throw createError({ statusCode: 400, message: 'Sort by a figure, a setting or a fact of the car.', data: { fields: [{ path: 'sort.field', message: 'Cannot sort by this' }] } })
  const desc = q.sort?.dir === 'desc'
  const dir = desc ? 'DESC' : 'ASC'
  const numeric = sortField.kind === 'number'
  // Missing values sort last either way; text keys are text-cast so one cursor form serves every field.
  const key = numeric ? `COALESCE(${sortField.sql}, '${desc ? '-' : ''}Infinity')` : `COALESCE(${sortField.sql}::text, '')`
  let after = 'true'
  if (q.cursor) {
    const c = decode(q.cursor, numeric)
    replacements.cursorValue = c.v ?? ''
    replacements.cursorId = c.id
    after = `(m.k, m."profileId") ${desc ? '<' : '>'} (CAST(:cursorValue AS ${numeric ? 'double precision' : 'text'}), :cursorId)`
  }
  const shown = resultFields(q.conditions)
  const valueCols = shown.map((f, i) => `, ${bound(fieldSql(f), `v${i}`, replacements)} AS "v${i}"`)
  // Straight on a pooled connection with the values as parameters (selectRows): no Sequelize work per search.
  const rows = await selectRows<Row>(
    `WITH m AS MATERIALIZED (
       SELECT e."profileId", e."vehicleId", e."versionId", e.warnings, ${key} AS k${valueCols.join('')}
         FROM on_car_evaluations e JOIN vehicles v ON v.id = e."vehicleId" JOIN platforms pl ON pl.id = v."platformId"
        WHERE ${where.join(' AND ')}),
     page AS (SELECT * FROM m WHERE ${after} ORDER BY m.k ${dir}, m."profileId" ${dir} LIMIT :limit)
     SELECT c.total, page.*, page.k::text AS "sortKey", x.*
       FROM (SELECT count(*) AS total FROM m) c LEFT JOIN page ON true
       -- Each page row looked up by its keys (LIMIT 1 keeps the planner from scanning whole tables to join a page).
       LEFT JOIN LATERAL (SELECT v."stockRef", v.make, v.model, v.year, v.status, v."driftedAt", pl.name AS "driveUnit", p.name AS "profileName", pv."versionNo"
         FROM vehicles v JOIN platforms pl ON pl.id = v."platformId" JOIN profiles p ON p.id = page."profileId" JOIN profile_versions pv ON pv.id = page."versionId"
        WHERE v.id = page."vehicleId" LIMIT 1) x ON true
      ORDER BY page.k ${dir}, page."profileId" ${dir}`, replacements)
  const found = rows.filter(r => r.profileId !== null)
  const more = found.length > q.limit
  const page = found.slice(0, q.limit)
  const items: SearchItem[] = page.map(r => ({
    vehicleId: r.vehicleId, stockRef: r.stockRef, make: r.make, model: r.model, year: r.year, status: r.status, driveUnit: r.driveUnit,
    profileName: r.profileName, versionId: r.versionId, versionNo: r.versionNo, driftedAt: r.driftedAt ? new Date(r.driftedAt).toISOString() : null, warnings: r.warnings,
    values: Object.fromEntries(shown.map((f, i) => [f, r[`v${i}`] as number | string | null]))
  }))
  const last = page.at(-1)
  return { items, total: Number(rows[0]?.total ?? 0), nextCursor: more && last ? encode({ v: last.sortKey, id: last.profileId! }) : null }
}
