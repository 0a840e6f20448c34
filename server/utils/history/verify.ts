import { QueryTypes } from 'sequelize'
import type { VerifyResult } from '../../../shared/schemas/history'
import { eventHash, type AuditRow } from './audit'
import { useDatabase } from '../database/db'

const BATCH = 5000

export interface NotedHead { id: string, hash: string }

// Walks a workshop's chain oldest first, keyset-paged by id, up to the head as it stood when the walk began:
// each event's prevHash must be the hash of the one before it, and its hash must be recomputable from its
// content in its form (docs/history.md). With a head an auditor noted earlier, also says whether that event
// is still in the chain with the same hash: removing the newest events leaves a valid but shorter chain.
export async function verifyChain(workshopId: number, noted?: NotedHead, batch = BATCH): Promise<VerifyResult> {
  const started = performance.now()
  const db = useDatabase()
  const [head] = await db.query<{ id: string, hash: string }>(
    'SELECT id, hash FROM audit_events WHERE "workshopId" = :workshopId ORDER BY id DESC LIMIT 1',
    { replacements: { workshopId }, type: QueryTypes.SELECT })
  let notedFound: string | null = null
  const result = (checked: number, firstBroken: VerifyResult['firstBroken']): VerifyResult => {
    const notedHead = noted ? notedHeadCheck(noted, notedFound, head ?? null) : undefined
    return {
      ok: !firstBroken && (notedHead?.ok ?? true), checked, firstBroken, head: head ? { id: String(head.id), hash: head.hash } : null,
      ...(notedHead ? { notedHead } : {}), durationMs: Math.round(performance.now() - started)
    }
  }
  if (!head) return result(0, null)
  const fetch = (after: string) => db.query<AuditRow>(
    `SELECT id, form, "workshopId", "vehicleId", "actorId", actor, action, "entityType", "entityId", data, "createdAt", "prevHash", hash
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
      if (eventHash(row) !== row.hash) {
        next?.catch(() => undefined)
        return result(checked, { ...at(), problem: 'content', message: 'Its content no longer matches its hash: the event was changed after it was written.' })
      }
      if (noted && String(row.id) === noted.id) notedFound = row.hash
      prevHash = row.hash
      checked++
    }
    if (!next) return result(checked, null)
    rows = await next
  }
}

// Whether the noted head was met on the walk with the hash the auditor noted.
function notedHeadCheck(noted: NotedHead, found: string | null, head: NotedHead | null): NonNullable<VerifyResult['notedHead']> {
  const base = { id: noted.id, hash: noted.hash }
  if (found === noted.hash) return { ...base, ok: true, problem: null, message: `Event ${noted.id} is still in the chain with the hash you noted.` }
  if (found !== null) return { ...base, ok: false, problem: 'changed', message: `Event ${noted.id} is in the chain but its hash is now ${found.slice(0, 12)}…, not the ${noted.hash.slice(0, 12)}… you noted: the chain was rewritten up to it.` }
  const end = head ? `the chain now ends at event ${head.id}` : 'the chain is now empty'
  return { ...base, ok: false, problem: 'missing', message: `Event ${noted.id} is no longer in the chain (${end}): events were removed, or the chain was not walked up to it because it breaks earlier.` }
}
