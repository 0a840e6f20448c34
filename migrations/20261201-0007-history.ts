import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// Indexes the history screens and the drift check read by, and where a read-back came from.
// The append-only trigger itself is in 0002; who owns audit_events is set by the stack scripts as the
// database superuser after every migration run (scripts/lib/history-guard.mjs), since the app's role may not.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addIndex('audit_events', ['workshopId', 'entityType', 'entityId', 'id'], { name: 'audit_events_entity' })
  await qi.addIndex('audit_events', ['workshopId', 'action', 'id'], { name: 'audit_events_action' })
  await qi.addIndex('audit_events', ['workshopId', 'actorId', 'id'], { name: 'audit_events_actor' })
  await qi.addColumn('readbacks', 'source', { type: DataTypes.TEXT, allowNull: false, defaultValue: 'typed' })
  await qi.addColumn('readbacks', 'readAt', { type: DataTypes.DATE, allowNull: true })
  await qi.addColumn('readbacks', 'controller', { type: DataTypes.JSONB, allowNull: false, defaultValue: {} })
  await qi.sequelize.query(`ALTER TABLE readbacks ADD CONSTRAINT readbacks_source CHECK (source IN ('file', 'paste', 'typed'))`)
  await qi.sequelize.query(`CREATE INDEX vehicles_drifted ON vehicles ("workshopId") WHERE "driftedAt" IS NOT NULL`)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex('vehicles', 'vehicles_drifted')
  for (const c of ['controller', 'readAt', 'source']) await qi.removeColumn('readbacks', c)
  for (const i of ['audit_events_actor', 'audit_events_action', 'audit_events_entity']) await qi.removeIndex('audit_events', i)
}
