import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'
import { refreshOnCarEvaluation } from '../server/utils/fleet/on-car-evaluation'

// The demo cars' on-car settings evaluated and kept for fleet search, as a sign-off would have done.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.transaction(t => refreshOnCarEvaluation(t, 'all'))
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DELETE FROM on_car_evaluations')
}
