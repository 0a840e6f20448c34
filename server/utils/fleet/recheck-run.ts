// The background side of a re-check (docs/fleet.md): any instance claims a batch of cars with
// FOR UPDATE SKIP LOCKED, evaluates each car's on-car settings again, records the result in the car's
// history, and the instance that sees a run complete mails its engineers, once.
import { QueryTypes, type Transaction } from 'sequelize'
import type { PlatformLike } from '../../../shared/compute/types'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import type { EvaluationSnapshot } from '../../../shared/schemas/profile-views'
import { newWarnings, worstRank } from '../../../shared/utils/new-warnings'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { evaluateOnServer, settingsOf } from '../platforms/evaluation'
import { mailRecheckResult } from './recheck-mail'
import { saveOnCarEvaluations } from './on-car-evaluation'

interface Claimed {
  id: string, recheckId: number, profileId: number, workshopId: number, vehicleId: number, versionId: number, versionNo: number, reason: string,
  parameters: Record<string, number>, evaluation: EvaluationSnapshot | null, spec: VehicleSpec, settings: unknown,
  platformKey: string, platformName: string, motorMaxRpm: number, schema: unknown
}

const BATCH = 100

async function claim(t: Transaction, limit: number) {
  return useDatabase().query<Claimed>(
    `SELECT i.id, i."recheckId", pv."profileId", i."workshopId", i."vehicleId", i."versionId", pv."versionNo", r.reason, pv.parameters, pv.evaluation, v.spec, w.settings,
            pl.key AS "platformKey", pl.name AS "platformName", pl."motorMaxRpm", pl.schema
       FROM fleet_recheck_items i JOIN fleet_rechecks r ON r.id = i."recheckId" JOIN profile_versions pv ON pv.id = i."versionId"
       JOIN vehicles v ON v.id = i."vehicleId" JOIN platforms pl ON pl.id = v."platformId" JOIN workshops w ON w.id = i."workshopId"
      WHERE i.state = 'pending' ORDER BY i.id LIMIT :limit FOR UPDATE OF i SKIP LOCKED`,
    { replacements: { limit }, type: QueryTypes.SELECT, transaction: t })
}

// Checks one batch; answers how many cars it checked (0 when nothing waits).
export async function runRecheckBatch(limit = BATCH): Promise<number> {
  const sequelize = useDatabase()
  return sequelize.transaction(async (t) => {
    const items = await claim(t, limit)
    if (!items.length) return 0
    const results = items.map((i) => {
      const platform: PlatformLike = { key: i.platformKey, name: i.platformName, motorMaxRpm: i.motorMaxRpm, schema: i.schema }
      const now = evaluateOnServer(i.spec, platform, i.parameters, settingsOf({ settings: i.settings }))
      const fresh = newWarnings(i.evaluation?.warnings ?? [], now.warnings).map(w => ({ rule: w.rule, severity: w.severity, message: w.message }))
      return { item: i, fresh, rank: worstRank(fresh), now }
    })
    await sequelize.query(`UPDATE fleet_recheck_items i SET state = 'done', "checkedAt" = now(), "newWarnings" = r.nw, "newWarningCount" = r.n, "worstRank" = r.rank
        FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(id bigint, nw jsonb, n integer, rank integer) WHERE i.id = r.id`,
    { replacements: { rows: JSON.stringify(results.map(r => ({ id: r.item.id, nw: r.fresh, n: r.fresh.length, rank: r.rank }))) }, transaction: t })
    await saveOnCarEvaluations(t, results.map(r => ({ ...r.item, evaluation: r.now })))
    for (const { item, fresh } of results) {
      await appendAuditEvent(t, {
        workshopId: item.workshopId, vehicleId: item.vehicleId, action: 'fleet.rechecked', entityType: 'version', entityId: item.versionId,
        data: { recheckId: item.recheckId, reason: item.reason, versionNo: item.versionNo, result: fresh.length ? 'new warnings' : 'no new warnings', newWarnings: fresh.map(w => ({ rule: w.rule, severity: w.severity })) }
      })
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
