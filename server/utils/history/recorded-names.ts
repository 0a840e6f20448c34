import { QueryTypes } from 'sequelize'
import type { VersionSummary } from '../../../shared/schemas/profile-views'
import { useDatabase } from '../database/db'

const STEPS = ['version.created', 'version.approved', 'version.signed-off'] as const
export type VersionStep = typeof STEPS[number]

// The SQL for who acted on an event: the name the event recorded (form 2), else the person's name today
// (form 1 kept only the id; docs/history.md). Needs audit_events as e and users as u.
export const ACTOR_NAME_SQL = `COALESCE(e.actor->>'name', u.name)`

interface Acted { actorId: number | null, name: string, eventId: number }

// The latest event of each of `steps` on each version, with who acted as the history named them then: one
// query for a version or a whole list.
async function latestActs(workshopId: number, versionIds: number[], steps: readonly string[]): Promise<Map<string, Partial<Record<string, Acted>>>> {
  const rows = await useDatabase().query<{ entityId: string, action: string, eventId: string, actorId: number | null, name: string | null }>(
    `SELECT DISTINCT ON (e."entityId", e.action) e."entityId", e.action, e.id AS "eventId", e."actorId", ${ACTOR_NAME_SQL} AS name
       FROM audit_events e LEFT JOIN users u ON u.id = e."actorId"
      WHERE e."workshopId" = :workshopId AND e."entityType" = 'version' AND e."entityId" IN (:ids) AND e.action IN (:steps)
      ORDER BY e."entityId", e.action, e.id DESC`,
    { replacements: { workshopId, ids: versionIds.map(String), steps }, type: QueryTypes.SELECT })
  const acts = new Map<string, Partial<Record<string, Acted>>>()
  for (const r of rows) {
    if (!r.name) continue
    acts.set(r.entityId, { ...acts.get(r.entityId), [r.action]: { actorId: r.actorId, name: r.name, eventId: Number(r.eventId) } })
  }
  return acts
}

// Who drafted, approved and signed off a version, as the history named them when they acted (the latest
// event of each step), so renaming someone later does not rewrite the handover sheet.
export async function recordedVersionActors(workshopId: number, versionId: number): Promise<Partial<Record<VersionStep, string>>> {
  const acts = (await latestActs(workshopId, [versionId], STEPS)).get(String(versionId)) ?? {}
  return Object.fromEntries(STEPS.filter(step => acts[step]).map(step => [step, acts[step]!.name]))
}

const person = (a: Acted | undefined) => a?.actorId ? { id: a.actorId, name: a.name } : undefined

// Version summaries with their author and last reviewer as the history named them when they acted (one query
// for the whole list), so a list of versions is not rewritten by a later rename either.
export async function withRecordedPeople(workshopId: number, summaries: VersionSummary[]): Promise<VersionSummary[]> {
  if (!summaries.length) return summaries
  const acts = await latestActs(workshopId, summaries.map(s => s.id), ['version.created', 'version.approved', 'version.rejected'])
  return summaries.map((s) => {
    const a = acts.get(String(s.id)) ?? {}
    const decided = [a['version.approved'], a['version.rejected']].filter(x => x?.actorId).sort((x, y) => y!.eventId - x!.eventId)[0]
    const lastReview = s.lastReview && decided ? { ...s.lastReview, reviewer: person(decided)! } : s.lastReview
    return { ...s, author: person(a['version.created']) ?? s.author, lastReview }
  })
}
