// The latest re-check of the workshop, with the cars that now raise warnings they did not at sign-off, worst first.
import { QueryTypes, type Transaction } from 'sequelize'
import type { RecheckCar, RecheckView } from '../../../shared/schemas/fleet'
import { useDatabase } from '../database/db'

interface RunRow { id: number, state: RecheckView['state'], reason: RecheckView['reason'], done: number, total: number, createdAt: Date, finishedAt: Date | null }

export async function worseCars(recheckId: number, limit: number, transaction?: Transaction): Promise<RecheckCar[]> {
  return useDatabase().query<RecheckCar>(
    `SELECT i."vehicleId", v."stockRef", v.make, v.model, v.year, v."driftedAt", i."versionId", pv."versionNo", p.name AS "profileName", i."newWarnings"
       FROM fleet_recheck_items i JOIN vehicles v ON v.id = i."vehicleId" JOIN profile_versions pv ON pv.id = i."versionId" JOIN profiles p ON p.id = pv."profileId"
      WHERE i."recheckId" = :recheckId AND i."worstRank" > 0
      ORDER BY i."worstRank" DESC, i."newWarningCount" DESC, v."stockRef" LIMIT :limit`,
    { replacements: { recheckId, limit }, type: QueryTypes.SELECT, transaction })
}

export async function latestRecheck(workshopId: number, limit = 500): Promise<RecheckView> {
  const [run] = await useDatabase().query<RunRow>(
    `SELECT id, state, reason, done, total, "createdAt", "finishedAt" FROM fleet_rechecks WHERE "workshopId" = :workshopId ORDER BY id DESC LIMIT 1`,
    { replacements: { workshopId }, type: QueryTypes.SELECT })
  if (!run) return { id: null, state: 'none', reason: null, done: 0, total: 0, startedAt: null, finishedAt: null, cars: [] }
  return {
    id: run.id, state: run.state, reason: run.reason, done: run.done, total: run.total,
    startedAt: new Date(run.createdAt).toISOString(), finishedAt: run.finishedAt ? new Date(run.finishedAt).toISOString() : null,
    cars: await worseCars(run.id, limit)
  }
}
