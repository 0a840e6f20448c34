import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// A road test entered at the roadside may be sent more than once (no signal, a retry, a reload): the phone
// gives each record a key of its own, and a second send with the same key finds the first record rather than
// making another. Unique per workshop; PostgreSQL lets any number of rows have none.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('road_tests', 'idempotencyKey', { type: DataTypes.UUID, allowNull: true })
  await qi.addIndex('road_tests', ['workshopId', 'idempotencyKey'], { name: 'road_tests_idempotency_key', unique: true })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex('road_tests', 'road_tests_idempotency_key')
  await qi.removeColumn('road_tests', 'idempotencyKey')
}
