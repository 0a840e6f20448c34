import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface } from 'sequelize'
import { roleValues } from '../shared/compute/roles'

// Fleet search reads typed columns rather than JSONB (docs/fleet.md): the car's searched spec facts as
// columns PostgreSQL computes from the spec on every write, and each on-car evaluation's role values (the
// settings in their role's own unit, the same whichever drive unit) as columns the sign-off and the
// re-check write. Existing rows get their role values here.
const SPEC_NUMBERS = ['kerbMassKg', 'frontAxleLoadPct', 'wheelbaseMm', 'cgHeightMm', 'originalEnginePowerKw', 'packNominalVoltageV', 'packCapacityKwh']
const ROLE_COLUMNS = ['powerCapKw', 'torqueCapNm', 'regenTorqueLimitNm', 'liftOffRegenPct', 'brakeRegenPct', 'creepTorqueNm', 'creepSpeedKph', 'speedLimitKph',
  'reverseSpeedLimitKph', 'throttleProgression', 'motorDerateStartC', 'motorCutoffC', 'inverterDerateStartC', 'inverterCutoffC', 'batteryDerateStartC',
  'batteryCutoffC', 'batteryDischargeLimitA', 'batteryChargeLimitA']
const specColumn = (name: string) => `"spec${name[0]!.toUpperCase()}${name.slice(1)}"`
const BATCH = 1000

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const numbers = SPEC_NUMBERS.map(n => `ADD COLUMN ${specColumn(n)} double precision GENERATED ALWAYS AS (CASE WHEN jsonb_typeof(spec->'${n}') = 'number' THEN (spec->>'${n}')::double precision END) STORED`)
  await qi.sequelize.query(`
    ALTER TABLE vehicles ADD COLUMN "specDrivenAxle" text GENERATED ALWAYS AS (spec->>'drivenAxle') STORED, ${numbers.join(', ')};
    DROP INDEX IF EXISTS vehicles_driven_axle;
    ALTER TABLE on_car_evaluations ${ROLE_COLUMNS.map(c => `ADD COLUMN "${c}" double precision`).join(', ')};
    ALTER TABLE on_car_evaluations SET (fillfactor = 70);
  `)
  for (let after = 0; ;) {
    const rows = await qi.sequelize.query<{ profileId: number, settings: Record<string, unknown>, schema: unknown, torqueConstantNmPerA: number | null }>(
      `SELECT e."profileId", e.settings, pl.schema, pl."torqueConstantNmPerA" FROM on_car_evaluations e JOIN vehicles v ON v.id = e."vehicleId" JOIN platforms pl ON pl.id = v."platformId"
        WHERE e."profileId" > :after ORDER BY e."profileId" LIMIT ${BATCH}`, { replacements: { after }, type: QueryTypes.SELECT })
    if (!rows.length) break
    const values = rows.map(r => ({ profileId: r.profileId, ...roleValues(r.schema, r.settings, { torqueConstantNmPerA: r.torqueConstantNmPerA }).values }))
    await qi.sequelize.query(
      `UPDATE on_car_evaluations e SET ${ROLE_COLUMNS.map(c => `"${c}" = r."${c}"`).join(', ')}
         FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r("profileId" integer, ${ROLE_COLUMNS.map(c => `"${c}" double precision`).join(', ')})
        WHERE e."profileId" = r."profileId"`, { replacements: { rows: JSON.stringify(values) } })
    after = rows.at(-1)!.profileId
  }
  // The planner's figures for the new columns now, rather than when autovacuum next looks.
  await qi.sequelize.query('ANALYZE vehicles; ANALYZE on_car_evaluations')
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE on_car_evaluations RESET (fillfactor);
    ALTER TABLE on_car_evaluations ${ROLE_COLUMNS.map(c => `DROP COLUMN "${c}"`).join(', ')};
    ALTER TABLE vehicles DROP COLUMN "specDrivenAxle", ${SPEC_NUMBERS.map(n => `DROP COLUMN ${specColumn(n)}`).join(', ')};
    CREATE INDEX vehicles_driven_axle ON vehicles ("workshopId", (spec->>'drivenAxle'));
  `)
}
