import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface } from 'sequelize'
import { appendAuditEvent } from '../server/utils/history/audit'

// The demo workshop's own road-test checks beside the six drive checks: things a tester looks at on every car.
const demoChecks = [
  { key: 'heater-demister', label: 'Heater and demister', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'lights', label: 'Lights, indicators and stop lamps', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'steering-wheel-straight', label: 'Steering wheel straight on a level road', record: 'pass-fail', unit: null, min: null, max: null, required: false },
  { key: 'twelve-volt-supply', label: '12 V supply with the motor running', record: 'number', unit: 'V', min: 13.2, max: 14.8, required: false }
]

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.transaction(async (t) => {
    const [w] = await qi.sequelize.query<{ id: number, adminId: number }>(
      `SELECT w.id, u.id AS "adminId" FROM workshops w JOIN users u ON u."workshopId" = w.id AND u.email = 'admin@voltwright.test' LIMIT 1`, { type: QueryTypes.SELECT, transaction: t })
    if (!w) return
    for (const c of demoChecks) {
      const [row] = await qi.sequelize.query<{ id: number }>(
        `INSERT INTO workshop_checks ("workshopId", key, label, record, unit, min, max, required) VALUES (:workshopId, :key, :label, :record, :unit, :min, :max, :required)
         ON CONFLICT ("workshopId", key) DO NOTHING RETURNING id`, { replacements: { workshopId: w.id, ...c }, type: QueryTypes.SELECT, transaction: t })
      if (!row) continue
      await appendAuditEvent(t, { workshopId: w.id, actorId: w.adminId, action: 'workshop-check.created', entityType: 'workshop-check', entityId: row.id, data: { after: { ...c, platformKeys: null, retired: false } } })
    }
  })
}

// The checks' history cannot be deleted; retire them instead.
export const down: MigrationFn<QueryInterface> = async () => {
  throw new Error('Demo road-test checks are retired, not removed: their history is append-only.')
}
