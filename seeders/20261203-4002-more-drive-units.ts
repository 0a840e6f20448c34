import type { MigrationFn } from 'umzug'
import { QueryTypes } from 'sequelize'
import { morePlatforms } from '../shared/platforms'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { moreDemoCars } from './demo-cars'
import { bookIn, type SeedContext } from './demo-story'

// Three more shared drive units whose controllers have settings of their own (amps, hp and mph, switches,
// modes and a throttle map); a key already there is left alone.
export const up: MigrationFn<SeedContext> = async ({ context: seed }) => {
  const { qi, t } = seed
  for (const p of morePlatforms) {
    await qi.sequelize.query(
      `INSERT INTO platforms (key, name, "motorMaxRpm", "torqueConstantNmPerA", schema, "createdAt", "updatedAt")
       SELECT :key, :name, :motorMaxRpm, :torqueConstantNmPerA, CAST(:schema AS jsonb), now(), now()
        WHERE NOT EXISTS (SELECT 1 FROM platforms WHERE key = :key AND "workshopId" IS NULL)`,
      { replacements: { key: p.key, name: p.name, motorMaxRpm: p.motorMaxRpm, torqueConstantNmPerA: p.torqueConstantNmPerA ?? null, schema: JSON.stringify(p.schema) }, transaction: t })
  }
  await addCars(seed)
}

// Two cars of the demo workshop in for conversion on the new units, so their tune sheets can be tried.
async function addCars({ qi, t, story }: SeedContext) {
  const [w] = await qi.sequelize.query<{ id: number, adminId: number }>(
    `SELECT w.id, u.id AS "adminId" FROM workshops w JOIN users u ON u."workshopId" = w.id AND u.email = 'admin@voltwright.test' LIMIT 1`, { type: QueryTypes.SELECT, transaction: t })
  if (!w) return
  for (const car of moreDemoCars) {
    const spec = vehicleSpecSchema.parse(car.spec)
    const intake = story.day(car.intakeDaysAgo, '08:30')
    const [row] = await qi.sequelize.query<{ id: number }>(
      `INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, "chassisNumber", registration, status, spec, "platformId", "createdAt", "updatedAt")
       SELECT :workshopId, :stockRef, :make, :model, :year, :chassisNumber, :registration, :status, CAST(:spec AS jsonb), p.id, :intake, :intake
         FROM platforms p WHERE p.key = :platformKey AND p."workshopId" IS NULL RETURNING id`,
      { replacements: { workshopId: w.id, ...car, spec: JSON.stringify(spec), intake }, type: QueryTypes.SELECT, transaction: t })
    if (!row) continue
    bookIn(story, { workshopId: w.id, vehicleId: row.id, actorId: w.adminId }, car)
  }
}

// The cars' history cannot be deleted; the units stay while a car uses them.
export const down: MigrationFn<SeedContext> = async ({ context: { qi, t } }) => {
  await qi.sequelize.query('DELETE FROM platforms p WHERE key IN (:keys) AND "workshopId" IS NULL AND NOT EXISTS (SELECT 1 FROM vehicles v WHERE v."platformId" = p.id)',
    { replacements: { keys: morePlatforms.map(p => p.key) }, transaction: t })
}
