// Starting a re-check of a workshop's cars: one row per car with settings on it (docs/fleet.md).
import { QueryTypes, type Transaction } from 'sequelize'
import { RULES_RELEASE } from '../../../shared/compute/rules/release'
import type { RecheckReason } from '../../../shared/schemas/fleet'
import { useDatabase } from '../database/db'

// Inside the caller's transaction, so a re-check is queued if and only if the change that calls for it commits.
// An earlier run still going is superseded: its cars are in the new one.
export async function startRecheck(t: Transaction, workshopId: number, reason: RecheckReason, detail: Record<string, unknown>, requestedById: number | null) {
  const sequelize = useDatabase()
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: t })
  // Items before their run, the order a batch locks them in (runRecheckBatch claims items, then counts them on
  // the run), so a re-check started while a batch is being checked waits for it rather than deadlocking.
  await q(`UPDATE fleet_recheck_items SET state = 'skipped' WHERE state = 'pending'
      AND "recheckId" IN (SELECT id FROM fleet_rechecks WHERE "workshopId" = :workshopId AND state = 'running') RETURNING id`, { workshopId })
  await q(`UPDATE fleet_rechecks SET state = 'superseded', "finishedAt" = now() WHERE "workshopId" = :workshopId AND state = 'running' RETURNING id`, { workshopId })
  const [run] = await q<{ id: number }>(`INSERT INTO fleet_rechecks ("workshopId", reason, detail, "rulesRelease", "requestedById") VALUES (:workshopId, :reason, CAST(:detail AS jsonb), :release, :requestedById) RETURNING id`,
    { workshopId, reason, detail: JSON.stringify(detail), release: RULES_RELEASE, requestedById })
  const items = await q<{ n: string }>(`WITH added AS (
      INSERT INTO fleet_recheck_items ("recheckId", "workshopId", "vehicleId", "versionId")
      SELECT :id, v."workshopId", v.id, p."onCarVersionId" FROM profiles p JOIN vehicles v ON v.id = p."vehicleId"
       WHERE v."workshopId" = :workshopId AND p."onCarVersionId" IS NOT NULL ORDER BY v.id RETURNING 1)
    SELECT count(*) AS n FROM added`, { id: run!.id, workshopId })
  const total = Number(items[0]!.n)
  await q(`UPDATE fleet_rechecks SET total = :total, state = CASE WHEN :total = 0 THEN 'done' ELSE state END, "finishedAt" = CASE WHEN :total = 0 THEN now() END WHERE id = :id RETURNING id`, { id: run!.id, total })
  return { id: run!.id, total }
}

// On start: every workshop whose cars were last checked against an older rules release is re-checked once.
// The UPDATE … RETURNING hands each workshop to one instance only.
export async function startRulesRechecks() {
  await useDatabase().transaction(async (t) => {
    const stale = await useDatabase().query<{ id: number, before: number }>(
      `UPDATE workshops w SET "rulesRelease" = :release FROM (SELECT id, "rulesRelease" AS before FROM workshops WHERE "rulesRelease" < :release FOR UPDATE SKIP LOCKED) old
        WHERE w.id = old.id RETURNING w.id, old.before`, { replacements: { release: RULES_RELEASE }, type: QueryTypes.SELECT, transaction: t })
    for (const w of stale) await startRecheck(t, w.id, 'rules', { fromRelease: w.before, toRelease: RULES_RELEASE }, null)
  })
}
