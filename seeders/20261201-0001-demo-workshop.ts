import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { firstPlatforms as platforms } from '../shared/platforms'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { appendAuditEvent } from '../server/utils/history/audit'
import { demoCars, secondWorkshopCar, type DemoCar } from './demo-cars'

// Demo only: every demo person signs in with this password (README).
const DEMO_PASSWORD = 'voltwright-demo'

const demoPeople = [
  { email: 'admin@voltwright.test', name: 'Imogen Rook', roles: ['admin'] },
  { email: 'tuner@voltwright.test', name: 'Dev Carrow', roles: ['tuner'] },
  { email: 'engineer@voltwright.test', name: 'Maud Ellery', roles: ['engineer'] },
  { email: 'tester@voltwright.test', name: 'Sol Brannagh', roles: ['tester'] },
  { email: 'auditor@voltwright.test', name: 'Petra Vaine', roles: ['auditor'] },
  { email: 'client@voltwright.test', name: 'Hollis Trent', roles: ['client'] },
  { email: 'lead@voltwright.test', name: 'Ravi Ostrander', roles: ['engineer', 'tuner', 'tester'] }
]
const secondPeople = [
  { email: 'admin@second.voltwright.test', name: 'Juno Hatherley', roles: ['admin'] },
  { email: 'tuner@second.voltwright.test', name: 'Cass Welbeck', roles: ['tuner', 'engineer'] }
]

async function insert(qi: QueryInterface, t: Transaction, sql: string, replacements: Record<string, unknown>): Promise<number> {
  const [row] = await qi.sequelize.query<{ id: number }>(sql, { replacements, type: QueryTypes.SELECT, transaction: t })
  return row!.id
}

async function addPeople(qi: QueryInterface, t: Transaction, workshopId: number, people: typeof demoPeople, passwordHash: string) {
  const ids: Record<string, number> = {}
  for (const p of people) {
    ids[p.email] = await insert(qi, t, `INSERT INTO users ("workshopId", email, name, "passwordHash", roles) VALUES (:workshopId, :email, :name, :passwordHash, ARRAY[:roles]::text[]) RETURNING id`, { workshopId, ...p, passwordHash })
  }
  return ids
}

async function addCar(qi: QueryInterface, t: Transaction, workshopId: number, car: DemoCar, platformIds: number[], ownerId: number | null, actorId: number) {
  const spec = vehicleSpecSchema.parse(car.spec)
  const id = await insert(qi, t, `INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, "chassisNumber", registration, "ownerUserId", status, spec, "platformId")
    VALUES (:workshopId, :stockRef, :make, :model, :year, :chassisNumber, :registration, :ownerId, :status, CAST(:spec AS jsonb), :platformId) RETURNING id`,
  { workshopId, ...car, ownerId, spec: JSON.stringify(spec), platformId: platformIds[car.platformIndex] })
  await appendAuditEvent(t, { workshopId, vehicleId: id, actorId, action: 'vehicle.created', entityType: 'vehicle', entityId: id, data: { stockRef: car.stockRef, make: car.make, model: car.model, status: car.status } })
}

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const passwordHash = await new Hash(new Scrypt({})).make(DEMO_PASSWORD)
  await qi.sequelize.transaction(async (t) => {
    const platformIds: number[] = []
    for (const p of platforms) {
      platformIds.push(await insert(qi, t, `INSERT INTO platforms (key, name, "motorMaxRpm", schema) VALUES (:key, :name, :motorMaxRpm, CAST(:schema AS jsonb)) RETURNING id`, { ...p, schema: JSON.stringify(p.schema) }))
    }
    const workshopId = await insert(qi, t, `INSERT INTO workshops (name, settings) VALUES (:name, '{}') RETURNING id`, { name: 'Old Forge Electric Works' })
    const people = await addPeople(qi, t, workshopId, demoPeople, passwordHash)
    for (const car of demoCars) await addCar(qi, t, workshopId, car, platformIds, car.ownedByClient ? people['client@voltwright.test']! : null, people['admin@voltwright.test']!)

    const secondId = await insert(qi, t, `INSERT INTO workshops (name, settings) VALUES (:name, '{}') RETURNING id`, { name: 'Second Bay Motor Conversions' })
    const second = await addPeople(qi, t, secondId, secondPeople, passwordHash)
    await addCar(qi, t, secondId, secondWorkshopCar, platformIds, null, second['admin@second.voltwright.test']!)
  })
}

// Demo data is removed with the database; audit events cannot be deleted by design.
export const down: MigrationFn<QueryInterface> = async () => {
  throw new Error('The demo workshop cannot be un-seeded: its history is append-only. Drop the database instead.')
}
