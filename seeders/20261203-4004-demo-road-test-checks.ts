import type { MigrationFn } from 'umzug'
import { QueryTypes } from 'sequelize'
import type { SeedContext } from './demo-story'

// The demo workshop's own road-test checks beside the six drive checks: things a tester looks at on every car.
const demoChecks = [
  { key: 'heater-demister', label: 'Heater and demister', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'lights', label: 'Lights, indicators and stop lamps', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'steering-wheel-straight', label: 'Steering wheel straight on a level road', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'twelve-volt-supply', label: '12 V supply with the motor running', record: 'number', unit: 'V', min: 13.2, max: 14.8, required: false }
]

// Added a week before the seed run, after the demo's recorded road tests.
export const up: MigrationFn<SeedContext> = async ({ context: { qi, t, story } }) => {
  const at = story.day(7, '16:00')
  const [w] = await qi.sequelize.query<{ id: number, adminId: number }>(
    `SELECT w.id, u.id AS "adminId" FROM workshops w JOIN users u ON u."workshopId" = w.id AND u.email = 'admin@voltwright.test' LIMIT 1`, { type: QueryTypes.SELECT, transaction: t })
  if (!w) return
  for (const c of demoChecks) {
    const [row] = await qi.sequelize.query<{ id: number }>(
      `INSERT INTO workshop_checks ("workshopId", key, label, record, unit, min, max, required, "createdAt", "updatedAt") VALUES (:workshopId, :key, :label, :record, :unit, :min, :max, :required, :at, :at)
       ON CONFLICT ("workshopId", key) DO NOTHING RETURNING id`, { replacements: { workshopId: w.id, ...c, at }, type: QueryTypes.SELECT, transaction: t })
    if (!row) continue
    story.add(at, { workshopId: w.id, actorId: w.adminId, action: 'workshop-check.created', entityType: 'workshop-check', entityId: row.id, data: { after: { ...c, platformKeys: null, retired: false } } })
  }
}

// The checks' history cannot be deleted; retire them instead.
export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('Demo road-test checks are retired, not removed: their history is append-only.')
}
