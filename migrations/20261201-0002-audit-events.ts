import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// The history nobody can quietly rewrite: rows are chained by hash and the database refuses to change them.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    workshopId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workshops', key: 'id' } },
    vehicleId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'vehicles', key: 'id' } },
    actorId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    action: { type: DataTypes.TEXT, allowNull: false },
    entityType: { type: DataTypes.TEXT, allowNull: false },
    entityId: { type: DataTypes.TEXT, allowNull: false },
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    prevHash: { type: DataTypes.TEXT, allowNull: true },
    hash: { type: DataTypes.TEXT, allowNull: false }
  })
  await qi.addIndex('audit_events', ['workshopId', 'id'])
  await qi.addIndex('audit_events', ['vehicleId', 'id'])
  await qi.sequelize.query(`
    CREATE FUNCTION audit_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'audit_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER audit_events_append_only BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_refuse_change();
    CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_refuse_change();
  `)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('audit_events')
  await qi.sequelize.query('DROP FUNCTION IF EXISTS audit_events_refuse_change()')
}
