import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'

// Drive units declare their own settings; the ones the physics uses carry "x-role" (docs/computation.md,
// "Roles"). Every unit stored so far carries the eighteen settings under their role value's name, so each
// gains its role and nothing else changes: profile versions keep their settings as they are.
export const ROLE_OF_SETTING: Record<string, string> = {
  powerCapKw: 'powerCap', torqueCapNm: 'torqueCap', regenTorqueLimitNm: 'regenTorqueLimit', liftOffRegenPct: 'liftOffRegen',
  brakeRegenPct: 'brakeRegen', creepTorqueNm: 'creepTorque', creepSpeedKph: 'creepSpeed', speedLimitKph: 'speedLimit',
  reverseSpeedLimitKph: 'reverseSpeedLimit', throttleProgression: 'throttleProgression', motorDerateStartC: 'motorDerateStart',
  motorCutoffC: 'motorCutoff', inverterDerateStartC: 'inverterDerateStart', inverterCutoffC: 'inverterCutoff',
  batteryDerateStartC: 'batteryDerateStart', batteryCutoffC: 'batteryCutoff', batteryDischargeLimitA: 'batteryDischargeLimit',
  batteryChargeLimitA: 'batteryChargeLimit'
}

// One statement per setting, so a unit lacking one (none should) is left as it is.
export function addRolesSql(): string[] {
  return Object.entries(ROLE_OF_SETTING).map(([name, role]) =>
    `UPDATE platforms SET schema = jsonb_set(schema, '{properties,${name},x-role}', '"${role}"')
      WHERE schema->'properties' ? '${name}' AND NOT (schema->'properties'->'${name}' ? 'x-role')`)
}

export function removeRolesSql(): string[] {
  return Object.keys(ROLE_OF_SETTING).map(name =>
    `UPDATE platforms SET schema = schema #- '{properties,${name},x-role}' WHERE schema->'properties' ? '${name}'`)
}

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE platforms ADD COLUMN "torqueConstantNmPerA" double precision CHECK ("torqueConstantNmPerA" > 0)')
  for (const sql of addRolesSql()) await qi.sequelize.query(sql)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const sql of removeRolesSql()) await qi.sequelize.query(sql)
  await qi.sequelize.query('ALTER TABLE platforms DROP COLUMN "torqueConstantNmPerA"')
}
