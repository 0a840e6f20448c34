// Keeps the evaluation of a profile's on-car version where fleet search can filter it (docs/fleet.md).
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize'
import { PARAMETER_NAMES } from '../../../shared/compute/parameters'
import type { Evaluation } from '../../../shared/compute/types'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { evaluateOnServer, settingsOf } from '../platforms/evaluation'

export interface OnCarRow { profileId: number, workshopId: number, vehicleId: number, versionId: number, parameters: Record<string, number>, evaluation: Pick<Evaluation, 'figures' | 'warnings' | 'roles'> }

// The figures, then the role values (each setting in its role's own unit, whichever drive unit).
const columns = ['liftOffDecelMs2', 'brakeRegenDecelMs2', 'gripDryMs2', 'gripWetMs2', 'gripSnowMs2', 'zeroTo50S', 'zeroTo100S', 'topSpeedKph', 'maxStartGradePct', 'creepHoldGradePct', 'powerRatioToOriginal', 'peakDischargeCurrentA', ...PARAMETER_NAMES] as const

function record(r: OnCarRow) {
  const f = r.evaluation.figures
  const w = r.evaluation.warnings
  return {
    profileId: r.profileId, workshopId: r.workshopId, vehicleId: r.vehicleId, versionId: r.versionId, settings: r.parameters,
    liftOffDecelMs2: f.liftOffDecelMs2, brakeRegenDecelMs2: f.brakeRegenDecelMs2,
    gripDryMs2: f.regenGripLimitMs2?.dry ?? null, gripWetMs2: f.regenGripLimitMs2?.wet ?? null, gripSnowMs2: f.regenGripLimitMs2?.snow ?? null,
    zeroTo50S: f.zeroTo50S, zeroTo100S: f.zeroTo100S, topSpeedKph: f.topSpeedKph, maxStartGradePct: f.maxStartGradePct, creepHoldGradePct: f.creepHoldGradePct,
    powerRatioToOriginal: f.powerRatioToOriginal, peakDischargeCurrentA: f.peakDischargeCurrentA,
    ...Object.fromEntries(PARAMETER_NAMES.map(n => [n, r.evaluation.roles?.[n] ?? null])),
    warnings: [...new Set(w.map(x => x.rule))], dangerCount: w.filter(x => x.severity === 'danger').length, cautionCount: w.filter(x => x.severity === 'caution').length
  }
}

// One statement for a whole batch (the re-check writes a hundred at a time).
export async function saveOnCarEvaluations(t: Transaction, rows: OnCarRow[]) {
  if (!rows.length) return
  const sequelize = (t as unknown as { sequelize: Sequelize }).sequelize
  const cols = columns.map(c => `"${c}"`).join(', ')
  const typed = columns.map(c => `"${c}" double precision`).join(', ')
  await sequelize.query(
    `INSERT INTO on_car_evaluations ("profileId", "workshopId", "vehicleId", "versionId", settings, ${cols}, warnings, "dangerCount", "cautionCount", "evaluatedAt")
     SELECT "profileId", "workshopId", "vehicleId", "versionId", settings, ${cols}, ARRAY(SELECT jsonb_array_elements_text(warnings)), "dangerCount", "cautionCount", now()
       FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r("profileId" integer, "workshopId" integer, "vehicleId" integer, "versionId" integer, settings jsonb, ${typed}, warnings jsonb, "dangerCount" integer, "cautionCount" integer)
     ON CONFLICT ("profileId") DO UPDATE SET "versionId" = EXCLUDED."versionId", settings = EXCLUDED.settings, ${columns.map(c => `"${c}" = EXCLUDED."${c}"`).join(', ')},
       warnings = EXCLUDED.warnings, "dangerCount" = EXCLUDED."dangerCount", "cautionCount" = EXCLUDED."cautionCount", "evaluatedAt" = now()`,
    { replacements: { rows: JSON.stringify(rows.map(record)) }, transaction: t })
}

interface LoadedRow { profileId: number, workshopId: number, vehicleId: number, versionId: number, parameters: Record<string, number>, spec: VehicleSpec, settings: unknown, key: string, name: string, motorMaxRpm: number, torqueConstantNmPerA: number | null, schema: unknown }

// After a sign-off (and for the demo data): profiles' on-car versions evaluated now and kept for search.
export async function refreshOnCarEvaluation(t: Transaction, profileId: number | 'all') {
  const sequelize = (t as unknown as { sequelize: Sequelize }).sequelize
  const rows = await sequelize.query<LoadedRow>(
    `SELECT p.id AS "profileId", v."workshopId", v.id AS "vehicleId", pv.id AS "versionId", pv.parameters, v.spec, w.settings, pl.key, pl.name, pl."motorMaxRpm", pl."torqueConstantNmPerA", pl.schema
       FROM profiles p JOIN vehicles v ON v.id = p."vehicleId" JOIN profile_versions pv ON pv.id = p."onCarVersionId" JOIN platforms pl ON pl.id = v."platformId" JOIN workshops w ON w.id = v."workshopId"
      WHERE ${profileId === 'all' ? 'true' : 'p.id = :profileId'}`, { replacements: { profileId }, type: QueryTypes.SELECT, transaction: t })
  const evaluated = rows.map(row => ({ ...row, evaluation: evaluateOnServer(row.spec, { key: row.key, name: row.name, motorMaxRpm: row.motorMaxRpm, torqueConstantNmPerA: row.torqueConstantNmPerA, schema: row.schema }, row.parameters, settingsOf({ settings: row.settings })) }))
  await saveOnCarEvaluations(t, evaluated)
}
