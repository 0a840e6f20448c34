// A version drafted from another records only the patch between them; the history shows each changed setting's
// value in the parent as it stood when the draft was made, folded from the parent's own events before that moment.
import { QueryTypes } from 'sequelize'
import { foldEvent, foldSource, type KnownState } from '../../../shared/utils/audit-changes'
import { useDatabase } from '../database/db'

interface Row { id: string, action: string, data: Record<string, unknown> }
const PER_PARENT = 100

export async function parentSettings(workshopId: number, rows: Row[]): Promise<Map<string, Record<string, unknown>>> {
  const wanted = rows.filter(r => r.action === 'version.created' && r.data.parentVersionId != null && Array.isArray(r.data.patchFromParent))
  const found = new Map<string, Record<string, unknown>>()
  if (!wanted.length) return found
  const tuples = wanted.map(r => [String(r.data.parentVersionId), String(r.id)])
  const events = await useDatabase().query<Row & { bound: string }>(
    `SELECT x.id, x.action, x.data, q.bound FROM (VALUES :tuples) AS q(ei, bound) CROSS JOIN LATERAL (
       SELECT id, action, data FROM audit_events WHERE "workshopId" = :workshopId AND "entityType" = 'version' AND "entityId" = q.ei
         AND id < q.bound::bigint ORDER BY id DESC LIMIT :perParent) x ORDER BY x.id`,
    { replacements: { workshopId, tuples, perParent: PER_PARENT }, type: QueryTypes.SELECT })
  for (const r of wanted) {
    let state: KnownState = { known: false, state: undefined }
    for (const e of events) if (e.bound === String(r.id)) state = foldEvent(state, foldSource(e.action, e.data))
    const parameters = (state.state as { parameters?: unknown } | undefined)?.parameters
    if (parameters && typeof parameters === 'object') found.set(String(r.id), parameters as Record<string, unknown>)
  }
  return found
}
