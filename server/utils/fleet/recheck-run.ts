// The background side of a re-check (docs/fleet.md): any instance claims a batch of cars with
// FOR UPDATE SKIP LOCKED, evaluates each car's on-car settings again, records the result in the car's
// history, and the instance that sees a run complete mails its engineers, once.
import { QueryTypes, type Transaction } from 'sequelize'
import type { PlatformLike, Warning } from '../../../shared/compute/types'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { newWarnings, worstRank } from '../../../shared/utils/new-warnings'
import { useDatabase } from '../database/db'
import { appendAuditEvents } from '../history/audit'
import { evaluateOnServer, settingsOf } from '../platforms/evaluation'
import { mailRecheckResult } from './recheck-mail'
import { saveOnCarEvaluations } from './on-car-evaluation'

interface Claimed {
  id: string, recheckId: number, profileId: number, workshopId: number, vehicleId: number, versionId: number, versionNo: number, reason: string,
  parameters: Record<string, number>, signedWarnings: Warning[] | null, spec: VehicleSpec, settings: unknown, platformId: number
}

const BATCH = 100

// A batch's cars, each with what its check needs: the signed-off warnings rather than the whole evaluation kept.
async function claim(t: Transaction, limit: number) {
  return useDatabase().query<Claimed>(
    `SELECT i.id, i."recheckId", pv."profileId", i."workshopId", i."vehicleId", i."versionId", pv."versionNo", r.reason, pv.parameters,
            pv.evaluation->'warnings' AS "signedWarnings", v.spec, w.settings, v."platformId"
       FROM fleet_recheck_items i JOIN fleet_rechecks r ON r.id = i."recheckId" JOIN profile_versions pv ON pv.id = i."versionId"
       JOIN vehicles v ON v.id = i."vehicleId" JOIN workshops w ON w.id = i."workshopId"
      WHERE i.state = 'pending' ORDER BY i.id LIMIT :limit FOR UPDATE OF i SKIP LOCKED`,
    { replacements: { limit }, type: QueryTypes.SELECT, transaction: t })
}

// The drive units of a batch, each read once (a fleet has a few units and many cars).
async function platformsOf(t: Transaction, items: Claimed[]): Promise<Map<number, PlatformLike>> {
  const rows = await useDatabase().query<PlatformLike & { id: number }>(
    'SELECT id, key, name, "motorMaxRpm", "torqueConstantNmPerA", schema FROM platforms WHERE id IN (:ids)',
    { replacements: { ids: [...new Set(items.map(i => i.platformId))] }, type: QueryTypes.SELECT, transaction: t })
  return new Map(rows.map(({ id, ...p }) => [id, p]))
}

// Checks one batch in one transaction; answers how many cars it checked (0 when nothing waits).
export async function runRecheckBatch(limit = BATCH): Promise<number> {
  const sequelize = useDatabase()
  return sequelize.transaction(async (t) => {
    const items = await claim(t, limit)
    if (!items.length) return 0
    const platforms = await platformsOf(t, items)
    const results = items.map((i) => {
      const now = evaluateOnServer(i.spec, platforms.get(i.platformId)!, i.parameters, settingsOf({ settings: i.settings }))
      const fresh = newWarnings(i.signedWarnings ?? [], now.warnings).map(w => ({ rule: w.rule, severity: w.severity, message: w.message }))
      return { item: i, fresh, rank: worstRank(fresh), now }
    })
    await sequelize.query(`UPDATE fleet_recheck_items i SET state = 'done', "checkedAt" = now(), "newWarnings" = r.nw, "newWarningCount" = r.n, "worstRank" = r.rank
        FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(id bigint, nw jsonb, n integer, rank integer) WHERE i.id = r.id`,
    { replacements: { rows: JSON.stringify(results.map(r => ({ id: r.item.id, nw: r.fresh, n: r.fresh.length, rank: r.rank }))) }, transaction: t })
    await saveOnCarEvaluations(t, results.map(r => ({ ...r.item, evaluation: r.now })))
    const byWorkshop = new Map<number, typeof results>()
    for (const r of results) byWorkshop.set(r.item.workshopId, [...(byWorkshop.get(r.item.workshopId) ?? []), r])
    for (const [workshopId, list] of byWorkshop) {
      await appendAuditEvents(t, workshopId, list.map(({ item, fresh }) => ({
        workshopId, vehicleId: item.vehicleId, action: 'fleet.rechecked', entityType: 'version', entityId: item.versionId,
        data: { recheckId: item.recheckId, reason: item.reason, versionNo: item.versionNo, result: fresh.length ? 'new warnings' : 'no new warnings', newWarnings: fresh.map(w => ({ rule: w.rule, severity: w.severity })) }
      })))
    }
    const counts = new Map<number, number>()
    for (const r of results) counts.set(r.item.recheckId, (counts.get(r.item.recheckId) ?? 0) + 1)
    for (const [id, n] of counts) await sequelize.query('UPDATE fleet_rechecks SET done = done + :n WHERE id = :id', { replacements: { id, n }, transaction: t })
    return items.length
  })
}

// Runs that have checked every car are closed and their engineers mailed; the row lock makes that once.
export async function finishRechecks(): Promise<number> {
  const sequelize = useDatabase()
  return sequelize.transaction(async (t) => {
    const finished = await sequelize.query<{ id: number, workshopId: number, reason: string }>(
      `SELECT id, "workshopId", reason FROM fleet_rechecks WHERE state = 'running' AND done >= total FOR UPDATE SKIP LOCKED`, { type: QueryTypes.SELECT, transaction: t })
    for (const run of finished) {
      await sequelize.query(`UPDATE fleet_rechecks SET state = 'done', "finishedAt" = now() WHERE id = :id`, { replacements: { id: run.id }, transaction: t })
      await mailRecheckResult(t, run)
    }
    return finished.length
  })
}
