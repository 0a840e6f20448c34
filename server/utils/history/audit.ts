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

// Appends one event to the workshop's chain inside the caller's transaction, in the current form. The
// advisory lock serialises writers on the chain head, so concurrent changes never fork it.
export async function appendAuditEvent(t: Transaction, input: AuditInput): Promise<AuditRow> {
  const sequelize = (t as unknown as { sequelize: Sequelize }).sequelize
  const actorId = input.actorId ?? null
  const [people] = await Promise.all([
    actorId === null ? [] : sequelize.query<RecordedActor>('SELECT name, email FROM users WHERE id = :id', { replacements: { id: actorId }, type: QueryTypes.SELECT, transaction: t }),
    sequelize.query('SELECT pg_advisory_xact_lock(7301, :w)', { replacements: { w: input.workshopId }, transaction: t })
  ])
  if (actorId !== null && !people[0]) throw new Error(`appendAuditEvent: no person ${actorId}`)
  const [head] = await sequelize.query<{ hash: string }>(
    'SELECT hash FROM audit_events WHERE "workshopId" = :w ORDER BY id DESC LIMIT 1',
    { replacements: { w: input.workshopId }, type: QueryTypes.SELECT, transaction: t })
  const row: Hashed = {
    form: CURRENT_FORM, workshopId: input.workshopId, vehicleId: input.vehicleId ?? null, actorId,
    actor: people[0] ? { name: people[0].name, email: people[0].email } : null,
    action: input.action, entityType: input.entityType, entityId: String(input.entityId),
    // Hashed as PostgreSQL will give it back: plain JSON, no undefined, no Dates.
    data: JSON.parse(JSON.stringify(input.data ?? {})), createdAt: new Date(), prevHash: head?.hash ?? null
  }
  const hash = eventHash(row)
  const [inserted] = await sequelize.query<{ id: string }>(
    `INSERT INTO audit_events (form, "workshopId", "vehicleId", "actorId", actor, action, "entityType", "entityId", data, "createdAt", "prevHash", hash)
     VALUES (:form, :workshopId, :vehicleId, :actorId, CAST(:actor AS jsonb), :action, :entityType, :entityId, CAST(:data AS jsonb), :createdAt, :prevHash, :hash) RETURNING id`,
    { replacements: { ...row, actor: row.actor ? JSON.stringify(row.actor) : null, data: JSON.stringify(row.data), hash }, type: QueryTypes.SELECT, transaction: t })
  return { ...row, id: String(inserted!.id), hash }
}
