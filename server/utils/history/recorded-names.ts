import { QueryTypes } from 'sequelize'
import type { VersionSummary } from '../../../shared/schemas/profile-views'
import { useDatabase } from '../database/db'

const STEPS = ['version.created', 'version.approved', 'version.signed-off'] as const
export type VersionStep = typeof STEPS[number]

// The SQL for who acted on an event: the name the event recorded (form 2), else the person's name today
// (form 1 kept only the id; docs/history.md). Needs audit_events as e and users as u.
export const ACTOR_NAME_SQL = `COALESCE(e.actor->>'name', u.name)`

// Who drafted, approved and signed off a version, as the history named them when they acted (the latest
// event of each step), so renaming someone later does not rewrite the handover sheet.
export async function recordedVersionActors(workshopId: number, versionId: number): Promise<Partial<Record<VersionStep, string>>> {
  const rows = await useDatabase().query<{ action: VersionStep, name: string | null }>(
    `SELECT DISTINCT ON (e.action) e.action, ${ACTOR_NAME_SQL} AS name
       FROM audit_events e LEFT JOIN users u ON u.id = e."actorId"
      WHERE e."workshopId" = :workshopId AND e."entityType" = 'version' AND e."entityId" = :versionId AND e.action IN (:steps)
      ORDER BY e.action, e.id DESC`,
    { replacements: { workshopId, versionId: String(versionId), steps: STEPS }, type: QueryTypes.SELECT })
  return Object.fromEntries(rows.filter(r => r.name).map(r => [r.action, r.name!]))
}

// Version summaries with their author and last reviewer as the history named them when they acted (one query
// for the whole list), so a list of versions is not rewritten by a later rename either.
export async function withRecordedPeople(workshopId: number, summaries: VersionSummary[]): Promise<VersionSummary[]> {
  if (!summaries.length) return summaries
  const rows = await useDatabase().query<{ entityId: string, action: string, actorId: number, name: string | null }>(
    `SELECT e."entityId", e.action, e."actorId", ${ACTOR_NAME_SQL} AS name
       FROM audit_events e LEFT JOIN users u ON u.id = e."actorId"
      WHERE e."workshopId" = :workshopId AND e."entityType" = 'version' AND e."entityId" IN (:ids)
        AND e.action IN ('version.created', 'version.approved', 'version.rejected') AND e."actorId" IS NOT NULL
      ORDER BY e.id`,
    { replacements: { workshopId, ids: summaries.map(s => String(s.id)) }, type: QueryTypes.SELECT })
  const author = new Map<string, { id: number, name: string }>()
  const decider = new Map<string, { id: number, name: string }>()
  for (const r of rows) {
    if (!r.name) continue
    const who = { id: r.actorId, name: r.name }
    if (r.action === 'version.created') author.set(r.entityId, who)
    else decider.set(r.entityId, who)
  }
  return summaries.map((s) => {
    const key = String(s.id)
    const lastReview = s.lastReview && decider.has(key) ? { ...s.lastReview, reviewer: decider.get(key)! } : s.lastReview
    return { ...s, author: author.get(key) ?? s.author, lastReview }
  })
}
