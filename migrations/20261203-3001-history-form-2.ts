import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// Form 2 of the history (docs/history.md): each event says its form (earlier ones are form 1) and records who
// acted as they were named at that moment. audit_head_mails claims each workshop's daily mail of the chain's
// head, one row per workshop and day, so several server instances send it once.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('audit_events', 'form', { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 })
  await qi.addColumn('audit_events', 'actor', { type: DataTypes.JSONB, allowNull: true })
  await qi.sequelize.query('ALTER TABLE audit_events ADD CONSTRAINT audit_events_form CHECK (form IN (1, 2))')
  await qi.createTable('audit_head_mails', {
    workshopId: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'workshops', key: 'id' }, onDelete: 'CASCADE' },
    day: { type: DataTypes.DATEONLY, primaryKey: true },
    headId: { type: DataTypes.BIGINT, allowNull: true },
    headHash: { type: DataTypes.TEXT, allowNull: true },
    sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: qi.sequelize.fn('now') }
  })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('audit_head_mails')
  await qi.sequelize.query('ALTER TABLE audit_events DROP CONSTRAINT audit_events_form')
  await qi.removeColumn('audit_events', 'actor')
  await qi.removeColumn('audit_events', 'form')
}
