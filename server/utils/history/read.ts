import type { HistoryEntry, HistoryPage, HistoryQuery } from '../../../shared/schemas/history'
import { changeRows, copyState, creationRows, eventDetails, foldEvent, foldSource, isPatch, type KnownState } from '../../../shared/utils/audit-changes'
import { can } from '../../../shared/utils/permissions'
import { selectRows } from '../database/db'
import type { SignedIn } from '../guards/guards'
import { hashedRecord, type RecordedActor } from './audit'
import { eventNames } from './names'
import { parentSettings } from './parents'

export interface HistoryScope { workshopId: number, vehicleId?: number }

interface EventRow {
  id: string, form: number, workshopId: number, vehicleId: number | null, actorId: number | null, actor: RecordedActor | null, action: string, entityType: string, entityId: string
  data: Record<string, unknown>, createdAt: Date, prevHash: string | null, hash: string, actorName: string | null, stockRef: string | null
}

const SELECT = `SELECT e.id, e.form, e."workshopId", e."vehicleId", e."actorId", e.actor, e.action, e."entityType", e."entityId", e.data, e."createdAt", e."prevHash", e.hash,
  u.name AS "actorName", v."stockRef"
  FROM audit_events e LEFT JOIN users u ON u.id = e."actorId" LEFT JOIN vehicles v ON v.id = e."vehicleId"`

const likePrefix = (s: string) => `${s.replace(/[\\%_]/g, m => `\\${m}`)}%`
const isDay = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s)
const dayAfter = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString()

// The filters as SQL; an action ending in "." is a family ("version." is every version event).
function conditions(scope: HistoryScope, q: Omit<HistoryQuery, 'limit'>) {
  const where = ['e."workshopId" = :workshopId']
  const replacements: Record<string, unknown> = { workshopId: scope.workshopId }
  const add = (sql: string, name: string, value: unknown) => { where.push(sql); replacements[name] = value }
  if (scope.vehicleId) add('e."vehicleId" = :vehicleId', 'vehicleId', scope.vehicleId)
  if (q.cursor) add('e.id < :cursor', 'cursor', q.cursor)
  if (q.action) {
    if (q.action.endsWith('.')) add('e.action LIKE :action', 'action', likePrefix(q.action))
    else add('e.action = :action', 'action', q.action)
  }
  if (q.actorId) add('e."actorId" = :actorId', 'actorId', q.actorId)
  if (q.from) add('e."createdAt" >= :from', 'from', new Date(isDay(q.from) ? `${q.from}T00:00:00Z` : q.from).toISOString())
  if (q.to) {
    if (isDay(q.to)) add('e."createdAt" < :to', 'to', dayAfter(q.to))
    else add('e."createdAt" <= :to', 'to', new Date(q.to).toISOString())
  }
  return { where: where.join(' AND '), replacements }
}

const entityKey = (r: { entityType: string, entityId: string }) => `${r.entityType}\u0000${r.entityId}`

// Before-values for patches that carry none, folded from each entity's earlier events: at most PER_ENTITY
// of them, read newest first in one query; a value last set further back shows as not recorded. When the page
// holds every event of its range (no filters), only the events before the page are read.
const PER_ENTITY = 100
type FoldRow = Pick<EventRow, 'id' | 'action' | 'entityType' | 'entityId' | 'data'>
const needsFold = (r: EventRow) => isPatch(r.data.patch) && r.data.patch.some(o => o.op !== 'test') && r.data.before === undefined

async function foldedStates(workshopId: number, rows: EventRow[], complete: boolean): Promise<Map<string, KnownState>> {
  const needing = rows.filter(needsFold)
  const states = new Map<string, KnownState>()
  if (!needing.length) return states
  const keys = new Set(needing.map(entityKey))
  const onPage = new Map<string, EventRow[]>() // oldest first, per entity
  for (const r of [...rows].reverse()) {
    const key = entityKey(r)
    if (!keys.has(key)) continue
    if (!onPage.has(key)) onPage.set(key, [])
    onPage.get(key)!.push(r)
  }
  const tuples = [...onPage.values()].map((list) => {
    const bound = complete ? BigInt(list[0]!.id) : BigInt(list.filter(needsFold).at(-1)!.id) + BigInt(1)
    return [list[0]!.entityType, list[0]!.entityId, String(bound)]
  })
  const earlier = await selectRows<FoldRow>(
    `SELECT x.id, x.action, x."entityType", x."entityId", x.data FROM unnest(:types::text[], :ids::text[], :bounds::bigint[]) AS q(et, ei, bound) CROSS JOIN LATERAL (
       SELECT id, action, "entityType", "entityId", CASE WHEN action = 'version.created' THEN data ELSE jsonb_build_object('patch', data->'patch', 'after', data->'after') END AS data
         FROM audit_events
       WHERE "workshopId" = :workshopId AND "entityType" = q.et AND "entityId" = q.ei AND id < q.bound ORDER BY id DESC LIMIT :perEntity) x ORDER BY x.id`,
    { workshopId, types: tuples.map(t => t[0]), ids: tuples.map(t => t[1]), bounds: tuples.map(t => t[2]), perEntity: PER_ENTITY })
  const wanted = new Set(needing.map(r => String(r.id)))
  const priorOf = new Map<string, FoldRow[]>()
  for (const e of earlier) {
    const key = entityKey(e)
    if (!priorOf.has(key)) priorOf.set(key, [])
    priorOf.get(key)!.push(e)
  }
  for (const [key, page] of onPage) {
    const prior = priorOf.get(key) ?? [] // oldest first
    // One working copy per entity, folded in place; a state is copied out only where a page event needs it.
    let state: KnownState = { known: false, state: undefined }
    for (const e of complete ? [...prior, ...page] : prior) {
      if (wanted.has(String(e.id))) states.set(String(e.id), copyState(state))
      state = foldEvent(state, foldSource(e.action, e.data), true)
    }
  }
  return states
}

// Who acted: the name the event recorded (form 2), else the person's name today (form 1 kept only the id).
function actorOf(r: EventRow): HistoryEntry['actor'] {
  if (r.actorId === null) return null
  if (r.actor?.name) return { id: r.actorId, name: r.actor.name, recorded: true }
  return { id: r.actorId, name: r.actorName ?? 'someone no longer listed', recorded: false }
}

async function toEntries(workshopId: number, rows: EventRow[], complete: boolean, withRecord: boolean): Promise<HistoryEntry[]> {
  const [folds, names, parents] = await Promise.all([foldedStates(workshopId, rows, complete), eventNames(workshopId, rows), parentSettings(workshopId, rows)])
  return rows.map((r, i) => ({
    id: String(r.id), createdAt: new Date(r.createdAt).toISOString(), action: r.action, entityType: r.entityType, entityId: r.entityId,
    vehicle: r.vehicleId ? { id: r.vehicleId, stockRef: r.stockRef ?? '' } : null,
    actor: actorOf(r),
    changes: r.action === 'version.created' ? creationRows(r.data, parents.get(String(r.id))) : changeRows(r.data, folds.get(String(r.id))),
    details: eventDetails(r.data), names: names[i]!, hash: r.hash, prevHash: r.prevHash, form: r.form,
    ...(withRecord ? { record: hashedRecord(r) } : {})
  }))
}

// The hashed records carry each actor's e-mail as it was: for those who check the chain (docs/history.md#checking-it-yourself-with-the-documentation-only).
export function requireRecordAccess(user: SignedIn, include: string | undefined) {
  if (include === 'record' && !can(user.roles, 'history.verify')) {
    throw createError({ statusCode: 403, message: 'The hashed records are for the auditors and the workshop manager.' })
  }
}

// Newest first, keyset-paged by id: a page never repeats or skips an event, however many arrive meanwhile.
export async function readHistory(scope: HistoryScope, q: HistoryQuery): Promise<HistoryPage> {
  const { where, replacements } = conditions(scope, q)
  const rows = await selectRows<EventRow>(`${SELECT} WHERE ${where} ORDER BY e.id DESC LIMIT :limit`, { ...replacements, limit: q.limit + 1 })
  const page = rows.slice(0, q.limit)
  const items = await toEntries(scope.workshopId, page, !q.action && !q.actorId && !q.from && !q.to, q.include === 'record')
  return { items, nextCursor: rows.length > q.limit ? items[items.length - 1]!.id : null }
}

// Every matching event, page after page, for the CSV export and the print view.
export async function* walkHistory(scope: HistoryScope, q: Omit<HistoryQuery, 'limit'>, batch = 1000): AsyncGenerator<HistoryEntry[]> {
  let cursor = q.cursor
  for (;;) {
    const page = await readHistory(scope, { ...q, cursor, limit: batch })
    if (page.items.length) yield page.items
    if (!page.nextCursor) return
    cursor = page.nextCursor
  }
}

// The actions and people that occur in a car's or a workshop's history, for the filters. Over a whole
// workshop a skip scan on the (workshopId, action) and (workshopId, actorId) indexes keeps this quick.
export async function historyFacets(scope: HistoryScope) {
  const replacements = { workshopId: scope.workshopId, vehicleId: scope.vehicleId }
  const skipScan = (col: string) => `WITH RECURSIVE s AS (
      (SELECT ${col} AS v FROM audit_events WHERE "workshopId" = :workshopId AND ${col} IS NOT NULL ORDER BY ${col} LIMIT 1)
      UNION ALL
      SELECT (SELECT ${col} FROM audit_events WHERE "workshopId" = :workshopId AND ${col} > s.v ORDER BY ${col} LIMIT 1) FROM s WHERE s.v IS NOT NULL
    ) SELECT v FROM s WHERE v IS NOT NULL`
  const distinct = (col: string) => scope.vehicleId
    ? `SELECT DISTINCT ${col} AS v FROM audit_events WHERE "workshopId" = :workshopId AND "vehicleId" = :vehicleId AND ${col} IS NOT NULL`
    : skipScan(col)
  const [actions, actors] = await Promise.all([
    selectRows<{ v: string }>(`${distinct('action')} ORDER BY 1`, replacements),
    selectRows<{ id: number, name: string }>(`SELECT u.id, u.name FROM users u WHERE u."workshopId" = :workshopId AND u.id IN (${distinct('"actorId"')}) ORDER BY u.name`, replacements)
  ])
  return { actions: actions.map(a => a.v), actors }
}
