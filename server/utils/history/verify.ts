import { QueryTypes } from 'sequelize'
import type { VerifyResult } from '../../../shared/schemas/history'
import { auditHash, type AuditRow } from './audit'
import { useDatabase } from '../database/db'

const BATCH = 5000

// Walks a workshop's chain oldest first, keyset-paged by id, up to the head as it stood when the walk began:
// each event's prevHash must be the hash of the one before it, and its hash must be recomputable from its content.
export async function verifyChain(workshopId: number, batch = BATCH): Promise<VerifyResult> {
  const started = performance.now()
  const db = useDatabase()
  const [head] = await db.query<{ id: string, hash: string }>(
    'SELECT id, hash FROM audit_events WHERE "workshopId" = :workshopId ORDER BY id DESC LIMIT 1',
    { replacements: { workshopId }, type: QueryTypes.SELECT })
  const result = (checked: number, firstBroken: VerifyResult['firstBroken']): VerifyResult => ({
    ok: !firstBroken, checked, firstBroken, head: head ? { id: String(head.id), hash: head.hash } : null, durationMs: Math.round(performance.now() - started)
  })
  if (!head) return result(0, null)
  const fetch = (after: string) => db.query<AuditRow>(
    `SELECT id, "workshopId", "vehicleId", "actorId", action, "entityType", "entityId", data, "createdAt", "prevHash", hash
     FROM audit_events WHERE "workshopId" = :workshopId AND id > :after AND id <= :headId ORDER BY id LIMIT :batch`,
    { replacements: { workshopId, after, headId: head.id, batch }, type: QueryTypes.SELECT, raw: true })
  let prevHash: string | null = null
  let checked = 0
  let rows = await fetch('0')
  for (;;) {
    // The next batch is read while this one is hashed.
    const next = rows.length === batch ? fetch(String(rows[rows.length - 1]!.id)) : null
    for (const row of rows) {
      const at = () => ({ id: String(row.id), createdAt: new Date(row.createdAt).toISOString() })
      if (row.prevHash !== prevHash) {
        next?.catch(() => undefined)
        return result(checked, { ...at(), problem: 'link', message: prevHash === null
          ? 'The first event of the chain names a previous event that is not there.'
          : `Its previous hash does not match the event before it (expected ${prevHash.slice(0, 12)}…, found ${String(row.prevHash).slice(0, 12)}…): an event before it was removed, inserted or changed.` })
      }
      if (auditHash(row.prevHash, row) !== row.hash) {
        next?.catch(() => undefined)
        return result(checked, { ...at(), problem: 'content', message: 'Its content no longer matches its hash: the event was changed after it was written.' })
      }
      prevHash = row.hash
      checked++
    }
    if (!next) return result(checked, null)
    rows = await next
  }
}
