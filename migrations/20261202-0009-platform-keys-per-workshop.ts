import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'

// A drive unit's key is unique among Voltwright's shared units and within each workshop's own, so one
// workshop's keys are neither blocked by nor revealed to another's. A workshop's own key may not repeat a
// shared one either (the app checks: a car names its unit by key, among the shared and its workshop's own).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE platforms DROP CONSTRAINT IF EXISTS platforms_key_key')
  await qi.sequelize.query('CREATE UNIQUE INDEX platforms_shared_key ON platforms (key) WHERE "workshopId" IS NULL')
  await qi.sequelize.query('CREATE UNIQUE INDEX platforms_workshop_key ON platforms ("workshopId", key) WHERE "workshopId" IS NOT NULL')
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX platforms_workshop_key')
  await qi.sequelize.query('DROP INDEX platforms_shared_key')
  await qi.sequelize.query('ALTER TABLE platforms ADD CONSTRAINT platforms_key_key UNIQUE (key)')
}
