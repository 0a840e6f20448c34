import { createHash } from 'node:crypto'
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize'
import { canonicalJson } from '../../../shared/utils/canonical-json'

export interface AuditInput {
  workshopId: number
  vehicleId?: number | null
  actorId?: number | null
  action: string
  entityType: string
  entityId: string | number
  data?: Record<string, unknown>
}

// Who acted, as they were named at that moment (form 2 only; form 1 recorded the id alone).
export interface RecordedActor { name: string, email: string }

export interface AuditRow {
  id: string
  form: number
  workshopId: number
  vehicleId: number | null
  actorId: number | null
  actor: RecordedActor | null
  action: string
  entityType: string
  entityId: string
  data: Record<string, unknown>
  createdAt: Date | string
  prevHash: string | null
  hash: string
}

type Hashed = Omit<AuditRow, 'id' | 'hash'>

export const CURRENT_FORM = 2

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex')
}

// Form 1 (docs/history.md): everything but the id, the hash and the previous hash, keys in canonical order.
// Spelled out in canonical key order (canonicalJson's output for this object), since the verifier runs it on every event.
export function auditHashBody(row: Omit<Hashed, 'form' | 'actor'>): string {
  const n = (x: number | null | undefined) => (x === null || x === undefined ? 'null' : canonicalJson(x))
  return `{"action":${JSON.stringify(row.action)},"actorId":${n(row.actorId)},"createdAt":${JSON.stringify(new Date(row.createdAt).toISOString())},`
    + `${row.data === undefined ? '' : `"data":${canonicalJson(row.data)},`}"entityId":${JSON.stringify(String(row.entityId))},"entityType":${JSON.stringify(row.entityType)},`
    + `"vehicleId":${n(row.vehicleId)},"workshopId":${n(row.workshopId)}}`
}

// Form 1's hash: SHA-256 of the previous hash (empty for the first event) followed by the body.
export function auditHash(prevHash: string | null, row: Omit<Hashed, 'form' | 'actor'>): string {
  return sha256Hex((prevHash ?? '') + auditHashBody(row))
}

// The object an event's hash covers, in either form (docs/history.md). Form 1 leaves prevHash outside it.
export function hashedRecord(row: Hashed): Record<string, unknown> {
  const createdAt = new Date(row.createdAt).toISOString()
  if (row.form === 1) {
    return { action: row.action, actorId: row.actorId, createdAt, data: row.data, entityId: String(row.entityId), entityType: row.entityType, vehicleId: row.vehicleId, workshopId: row.workshopId }
  }
  const actor = row.actorId === null ? null : { id: row.actorId, name: row.actor?.name ?? null, email: row.actor?.email ?? null }
  return {
    form: row.form, prevHash: row.prevHash, workshopId: row.workshopId, vehicleId: row.vehicleId, actor,
    action: row.action, entityType: row.entityType, entityId: String(row.entityId), data: row.data, createdAt
  }
}

// Form 2: SHA-256 of the RFC 8785 form of the record, prevHash inside it. canonicalJson is RFC 8785 for JSON
// values (keys sorted by UTF-16 code units, ECMAScript number and string serialisation).
export function eventHash(row: Hashed): string {
  if (row.form === 1) return auditHash(row.prevHash, row)
  return sha256Hex(canonicalJson(hashedRecord(row)))
}

// Appends one event to the workshop's chain inside the caller's transaction, in the current form.
export async function appendAuditEvent(t: Transaction, input: AuditInput): Promise<AuditRow> {
  return (await appendAuditEvents(t, input.workshopId, [input]))[0]!
}

// Appends events to one workshop's chain in the order given, inside the caller's transaction: one lock, one
// read of the chain head and one insert however many (the fleet re-check writes a hundred at a time). The
// advisory lock serialises writers on the chain head, so concurrent changes never fork it.
export async function appendAuditEvents(t: Transaction, workshopId: number, inputs: AuditInput[]): Promise<AuditRow[]> {
  return writeEvents(t, workshopId, inputs)
}

// For the demo seed only (seeders/demo-story.ts): events dated when the things they record happened, so the
// demo's history reads as its story. Nothing an API caller sends reaches this. The dates must run from the
// chain's newest event up to now, in order, so nothing can be slipped in behind events already written.
export async function appendDatedAuditEvents(t: Transaction, workshopId: number, inputs: (AuditInput & { at: Date })[]): Promise<AuditRow[]> {
  return writeEvents(t, workshopId, inputs, inputs.map(i => new Date(i.at)))
}

// Without dates, the events are stamped now, once the chain is locked: later in the chain is never earlier in time.
async function writeEvents(t: Transaction, workshopId: number, inputs: AuditInput[], dates?: Date[]): Promise<AuditRow[]> {
  if (!inputs.length) return []
  if (inputs.some(i => i.workshopId !== workshopId)) throw new Error('appendAuditEvents: one workshop\'s chain at a time')
  const sequelize = (t as unknown as { sequelize: Sequelize }).sequelize
  const actorIds = [...new Set(inputs.map(i => i.actorId ?? null).filter((a): a is number => a !== null))]
  const [people] = await Promise.all([
    actorIds.length ? sequelize.query<RecordedActor & { id: number }>('SELECT id, name, email FROM users WHERE id IN (:ids)', { replacements: { ids: actorIds }, type: QueryTypes.SELECT, transaction: t }) : [],
    sequelize.query('SELECT pg_advisory_xact_lock(7301, :w)', { replacements: { w: workshopId }, transaction: t })
  ])
  const byId = new Map(people.map(p => [p.id, p]))
  for (const id of actorIds) if (!byId.has(id)) throw new Error(`appendAuditEvent: no person ${id}`)
  const [head] = await sequelize.query<{ hash: string, createdAt: Date }>(
    'SELECT hash, "createdAt" FROM audit_events WHERE "workshopId" = :w ORDER BY id DESC LIMIT 1',
    { replacements: { w: workshopId }, type: QueryTypes.SELECT, transaction: t })
  if (dates) requireInOrder(dates, head ? new Date(head.createdAt) : null)
  const now = new Date()
  let prevHash = head?.hash ?? null
  const rows = inputs.map((input, n) => {
    const actorId = input.actorId ?? null
    const person = actorId === null ? undefined : byId.get(actorId)
    const row: Hashed = {
      form: CURRENT_FORM, workshopId, vehicleId: input.vehicleId ?? null, actorId,
      actor: person ? { name: person.name, email: person.email } : null,
      action: input.action, entityType: input.entityType, entityId: String(input.entityId),
      // Hashed as PostgreSQL will give it back: plain JSON, no undefined, no Dates.
      data: JSON.parse(JSON.stringify(input.data ?? {})), createdAt: dates?.[n] ?? now, prevHash
    }
    const hash = eventHash(row)
    prevHash = hash
    return { ...row, hash }
  })
  // Inserted in chain order, so ids follow the chain.
  const inserted = await sequelize.query<{ id: string, hash: string }>(
    `INSERT INTO audit_events (form, "workshopId", "vehicleId", "actorId", actor, action, "entityType", "entityId", data, "createdAt", "prevHash", hash)
     SELECT r.form, r."workshopId", r."vehicleId", r."actorId", r.actor, r.action, r."entityType", r."entityId", r.data, r."createdAt", r."prevHash", r.hash
       FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(form integer, "workshopId" integer, "vehicleId" integer, "actorId" integer, actor jsonb, action text,
            "entityType" text, "entityId" text, data jsonb, "createdAt" timestamptz, "prevHash" text, hash text, n bigint)
      ORDER BY r.n RETURNING id, hash`,
    { replacements: { rows: JSON.stringify(rows.map((row, n) => ({ ...row, n }))) }, type: QueryTypes.SELECT, transaction: t })
  const ids = new Map(inserted.map(r => [r.hash, String(r.id)]))
  return rows.map((row) => {
    const id = ids.get(row.hash)
    if (id === undefined) throw new Error('appendAuditEvents: an event was not written')
    return { ...row, id }
  })
}

// A dated event may not fall before the chain's newest event, before the one it follows, or in the future.
function requireInOrder(dates: Date[], after: Date | null) {
  const now = Date.now()
  let previous = after?.getTime() ?? -Infinity
  for (const at of dates) {
    const time = at.getTime()
    if (!Number.isFinite(time) || time < previous || time > now) {
      throw new Error(`appendDatedAuditEvents: ${String(at)} is not between the chain's newest event and now, in order`)
    }
    previous = time
  }
}
