import { QueryTypes } from 'sequelize'
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
