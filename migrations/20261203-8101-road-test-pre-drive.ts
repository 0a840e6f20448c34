import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// The tester's confirmation, before setting off, that they read the pre-drive cautions and the car was ready,
// with the cautions' titles as they stood (docs/road-tests.md#before-you-set-off). Road tests recorded
// before it was asked for have none.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('road_tests', 'preDrive', { type: DataTypes.JSONB, allowNull: true })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('road_tests', 'preDrive')
}
