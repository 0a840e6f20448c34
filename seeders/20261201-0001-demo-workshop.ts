import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { firstPlatforms as platforms } from '../shared/platforms'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { demoCars, secondWorkshopCar, type DemoCar } from './demo-cars'
import { bookIn, type DemoStory, type SeedContext } from './demo-story'

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

// A workshop and its people, set up the day before its first car came in.
async function addWorkshop(qi: QueryInterface, t: Transaction, name: string, people: typeof demoPeople, passwordHash: string, at: Date) {
  const workshopId = await insert(qi, t, `INSERT INTO workshops (name, settings, "createdAt", "updatedAt") VALUES (:name, '{}', :at, :at) RETURNING id`, { name, at })
  const ids: Record<string, number> = {}
  for (const p of people) {
    ids[p.email] = await insert(qi, t, `INSERT INTO users ("workshopId", email, name, "passwordHash", roles, "createdAt", "updatedAt") VALUES (:workshopId, :email, :name, :passwordHash, ARRAY[:roles]::text[], :at, :at) RETURNING id`, { workshopId, ...p, passwordHash, at })
  }
  return { workshopId, people: ids }
}

// A car entered at its intake date (seeders/demo-cars.ts).
async function addCar(qi: QueryInterface, t: Transaction, story: DemoStory, workshopId: number, car: DemoCar, platformIds: number[], ownerId: number | null, actorId: number) {
  const spec = vehicleSpecSchema.parse(car.spec)
  const at = story.day(car.intakeDaysAgo, '08:30')
  const id = await insert(qi, t, `INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, "chassisNumber", registration, "ownerUserId", status, spec, "platformId", "createdAt", "updatedAt")
    VALUES (:workshopId, :stockRef, :make, :model, :year, :chassisNumber, :registration, :ownerId, :status, CAST(:spec AS jsonb), :platformId, :at, :at) RETURNING id`,
  { workshopId, ...car, ownerId, spec: JSON.stringify(spec), platformId: platformIds[car.platformIndex], at })
  bookIn(story, { workshopId, vehicleId: id, actorId }, car)
}

const setUpBefore = (story: DemoStory, cars: DemoCar[]) => story.day(Math.max(...cars.map(c => c.intakeDaysAgo)) + 1, '08:00')

export const up: MigrationFn<SeedContext> = async ({ context: { qi, t, story } }) => {
  const passwordHash = await new Hash(new Scrypt({})).make(DEMO_PASSWORD)
  const platformIds: number[] = []
  for (const p of platforms) {
    platformIds.push(await insert(qi, t, `INSERT INTO platforms (key, name, "motorMaxRpm", schema) VALUES (:key, :name, :motorMaxRpm, CAST(:schema AS jsonb)) RETURNING id`, { ...p, schema: JSON.stringify(p.schema) }))
  }
  const first = await addWorkshop(qi, t, 'Old Forge Electric Works', demoPeople, passwordHash, setUpBefore(story, demoCars))
  for (const car of demoCars) await addCar(qi, t, story, first.workshopId, car, platformIds, car.ownedByClient ? first.people['client@voltwright.test']! : null, first.people['admin@voltwright.test']!)

  const second = await addWorkshop(qi, t, 'Second Bay Motor Conversions', secondPeople, passwordHash, setUpBefore(story, [secondWorkshopCar]))
  await addCar(qi, t, story, second.workshopId, secondWorkshopCar, platformIds, null, second.people['admin@second.voltwright.test']!)
}

// Demo data is removed with the database; audit events cannot be deleted by design.
export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('The demo workshop cannot be un-seeded: its history is append-only. Drop the database instead.')
}
