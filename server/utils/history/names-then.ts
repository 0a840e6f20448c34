// Names as they were when an event was written: a person renamed later, or a snag retitled, is named in each
// earlier event as it was then, so a rename never rewrites the past (docs/history.md). One query per kind.
import { selectRows } from '../database/db'
import type { NameTimeline } from './name-timeline'

// People: each rename sets the new name from its event on; the first rename's old name held before it.
export async function personTimeline(workshopId: number, ids: Set<number>): Promise<NameTimeline> {
  if (!ids.size) return new Map()
  const rows = await selectRows<{ id: string, entityId: string, before: string, after: string | null }>(
    `SELECT id, "entityId", data->'before'->>'name' AS before, COALESCE(data->>'name', data->'after'->>'name') AS after FROM audit_events
      WHERE "workshopId" = :workshopId AND "entityType" = 'user' AND "entityId" = ANY(:ids::text[]) AND data->'before'->>'name' IS NOT NULL ORDER BY id`,
    { workshopId, ids: [...ids].map(String) })
  return group(rows.map(r => ({ record: Number(r.entityId), from: BigInt(r.id), name: r.after, before: r.before })))
}

// Snags: the title raised with, then each change of title, up to the newest event being named.
export async function snagTimeline(workshopId: number, ids: Set<number>, upTo: bigint): Promise<NameTimeline> {
  if (!ids.size) return new Map()
  const rows = await selectRows<{ id: string, entityId: string, title: string | null }>(
    `SELECT id, "entityId", COALESCE(data->'after'->>'title', CASE WHEN jsonb_typeof(data->'patch') = 'array' THEN
        (SELECT o->>'value' FROM jsonb_array_elements(data->'patch') o WHERE o->>'path' = '/title' AND o->>'op' IN ('add', 'replace') LIMIT 1) END) AS title
       FROM audit_events WHERE "workshopId" = :workshopId AND "entityType" = 'snag' AND "entityId" = ANY(:ids::text[]) AND action IN ('snag.created', 'snag.updated') AND id <= :upTo ORDER BY id`,
    { workshopId, ids: [...ids].map(String), upTo: String(upTo) })
  return group(rows.map(r => ({ record: Number(r.entityId), from: BigInt(r.id), name: r.title, before: undefined })))
}

function group(rows: { record: number, from: bigint, name: string | null, before: string | undefined }[]): NameTimeline {
  const timeline: NameTimeline = new Map()
  for (const r of rows) {
    if (!r.name) continue
    timeline.set(r.record, [...(timeline.get(r.record) ?? []), { from: r.from, name: r.name, ...(r.before === undefined ? {} : { before: r.before }) }])
  }
  return timeline
}
