import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// Photo thumbnails and captions, the chart series of a telemetry log, and the database's own guarantee
// that a profile has at most one signed-off version at a time.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('attachments', 'thumbnailKey', { type: DataTypes.TEXT, allowNull: true })
  await qi.addColumn('attachments', 'caption', { type: DataTypes.TEXT, allowNull: false, defaultValue: '' })
  await qi.addColumn('telemetry_logs', 'series', { type: DataTypes.JSONB, allowNull: true })
  await qi.sequelize.query(`
    CREATE UNIQUE INDEX profile_versions_one_signed_off ON profile_versions ("profileId") WHERE state = 'signed-off';
    ALTER TABLE attachments ADD CONSTRAINT attachments_owner_type CHECK ("ownerType" IN ('road-test', 'snag', 'telemetry'));
  `)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE attachments DROP CONSTRAINT attachments_owner_type;
    DROP INDEX profile_versions_one_signed_off;
  `)
  await qi.removeColumn('telemetry_logs', 'series')
  await qi.removeColumn('attachments', 'caption')
  await qi.removeColumn('attachments', 'thumbnailKey')
}
