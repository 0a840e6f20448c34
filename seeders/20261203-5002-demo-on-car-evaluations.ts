import type { MigrationFn } from 'umzug'
import { refreshOnCarEvaluation } from '../server/utils/fleet/on-car-evaluation'
import type { SeedContext } from './demo-story'

// The demo cars' on-car settings evaluated and kept for fleet search, as a sign-off would have done.
export const up: MigrationFn<SeedContext> = async ({ context: { t } }) => {
  await refreshOnCarEvaluation(t, 'all')
}

export const down: MigrationFn<SeedContext> = async ({ context: { qi, t } }) => {
  await qi.sequelize.query('DELETE FROM on_car_evaluations', { transaction: t })
}
