import type { MigrationFn } from 'umzug'
import { DataTypes, literal, type QueryInterface } from 'sequelize'

// The workshop's own road-test checks (docs/road-tests.md), changed or retired but never deleted; each road
// test keeps the list of extra checks it was recorded with.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('workshop_checks', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    workshopId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workshops', key: 'id' } },
    key: { type: DataTypes.TEXT, allowNull: false },
    label: { type: DataTypes.TEXT, allowNull: false },
    record: { type: DataTypes.TEXT, allowNull: false },
    unit: { type: DataTypes.TEXT, allowNull: true },
    min: { type: DataTypes.DOUBLE, allowNull: true },
    max: { type: DataTypes.DOUBLE, allowNull: true },
    required: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    platformKeys: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: true },
    retiredAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
    updatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
  })
  await qi.addIndex('workshop_checks', ['workshopId', 'key'], { unique: true })
  await qi.sequelize.query(`ALTER TABLE workshop_checks ADD CONSTRAINT workshop_checks_record CHECK (record IN ('pass-fail', 'number'))`)
  await qi.addColumn('road_tests', 'checkList', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('road_tests', 'checkList')
  await qi.dropTable('workshop_checks')
}
