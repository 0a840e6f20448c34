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

export interface AuditRow {
  id: string
  workshopId: number
  vehicleId: number | null
  actorId: number | null
  action: string
  entityType: string
  entityId: string
  data: Record<string, unknown>
  createdAt: Date | string
  prevHash: string | null
  hash: string
}

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex')
}

// What the hash covers: everything but the id and the hash itself (the id is assigned by the database).
// Spelled out in canonical key order (canonicalJson's output for this object), since the verifier runs it on every event.
export function auditHashBody(row: Omit<AuditRow, 'id' | 'hash'>): string {
  const n = (x: number | null | undefined) => (x === null || x === undefined ? 'null' : canonicalJson(x))
  return `{"action":${JSON.stringify(row.action)},"actorId":${n(row.actorId)},"createdAt":${JSON.stringify(new Date(row.createdAt).toISOString())},`
    + `${row.data === undefined ? '' : `"data":${canonicalJson(row.data)},`}"entityId":${JSON.stringify(String(row.entityId))},"entityType":${JSON.stringify(row.entityType)},`
    + `"vehicleId":${n(row.vehicleId)},"workshopId":${n(row.workshopId)}}`
}

export function auditHash(prevHash: string | null, row: Omit<AuditRow, 'id' | 'hash'>): string {
  return sha256Hex((prevHash ?? '') + auditHashBody(row))
}

// Appends one event to the workshop's chain inside the caller's transaction. The advisory lock serialises
// writers on the chain head, so concurrent changes never fork it.
export async function appendAuditEvent(t: Transaction, input: AuditInput): Promise<AuditRow> {
  const sequelize = (t as unknown as { sequelize: Sequelize }).sequelize
  await sequelize.query('SELECT pg_advisory_xact_lock(7301, :w)', { replacements: { w: input.workshopId }, transaction: t })
  const [head] = await sequelize.query<{ hash: string }>(
    'SELECT hash FROM audit_events WHERE "workshopId" = :w ORDER BY id DESC LIMIT 1',
    { replacements: { w: input.workshopId }, type: QueryTypes.SELECT, transaction: t })
  const row = {
    workshopId: input.workshopId, vehicleId: input.vehicleId ?? null, actorId: input.actorId ?? null,
    action: input.action, entityType: input.entityType, entityId: String(input.entityId),
    data: input.data ?? {}, createdAt: new Date(), prevHash: head?.hash ?? null
  }
  const hash = auditHash(row.prevHash, row)
  const [inserted] = await sequelize.query<{ id: string }>(
    `INSERT INTO audit_events ("workshopId", "vehicleId", "actorId", action, "entityType", "entityId", data, "createdAt", "prevHash", hash)
     VALUES (:workshopId, :vehicleId, :actorId, :action, :entityType, :entityId, CAST(:data AS jsonb), :createdAt, :prevHash, :hash) RETURNING id`,
    { replacements: { ...row, data: JSON.stringify(row.data), hash }, type: QueryTypes.SELECT, transaction: t })
  return { ...row, id: String(inserted!.id), hash }
}
