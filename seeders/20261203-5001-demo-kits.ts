import type { MigrationFn } from 'umzug'
import type { QueryInterface, Transaction } from 'sequelize'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { addVersion, profileOpened, rows, type Car, type Made } from './20261201-0002-demo-profiles'
import { demoKits, type DemoKit } from './demo-kits'
import { bookIn, type SeedContext } from './demo-story'

type Base = Omit<Car, 'id' | 'spec'>

async function insert(qi: QueryInterface, t: Transaction, sql: string, replacements: Record<string, unknown>) {
  const [row] = await rows<{ id: number }>(qi, t, sql, replacements)
  return row!.id
}

async function addVersions(seed: SeedContext, car: Car, people: Record<string, number>, profile: { id: number, name: string }, versions: DemoKit['baseline']) {
  const made: Made[] = []
  for (const [i, v] of versions.entries()) made.push(await addVersion(seed, car, people, profile, i + 1, made.at(-1) ?? null, v))
  return made
}

// A kit drawn up just before its baseline's first version; each of its cars entered at its intake date.
async function addKit(seed: SeedContext, base: Base, people: Record<string, number>, kit: DemoKit, platformId: number) {
  const { qi, t, story } = seed
  const author = people[kit.baseline[0]!.author]!
  const specTemplate = vehicleSpecSchema.parse(kit.specTemplate)
  const drawnUp = profileOpened(story, kit.baseline[0]!)
  const kitId = await insert(qi, t, `INSERT INTO kits ("workshopId", name, "platformId", fits, "specTemplate", "createdAt", "updatedAt") VALUES (:w, :name, :platformId, CAST(:fits AS jsonb), CAST(:spec AS jsonb), :drawnUp, :drawnUp) RETURNING id`,
    { w: base.workshopId, name: kit.name, platformId, fits: JSON.stringify(kit.fits), spec: JSON.stringify(specTemplate), drawnUp })
  story.add(drawnUp, { workshopId: base.workshopId, actorId: author, action: 'kit.created', entityType: 'kit', entityId: kitId, data: { after: { name: kit.name, platformKey: kit.platformKey, fits: kit.fits, specTemplate } } })
  const profileId = await insert(qi, t, `INSERT INTO profiles ("workshopId", "kitId", name, "createdAt", "updatedAt") VALUES (:w, :kitId, 'Baseline', :drawnUp, :drawnUp) RETURNING id`, { w: base.workshopId, kitId, drawnUp })
  await qi.sequelize.query('UPDATE kits SET "baselineProfileId" = :profileId WHERE id = :kitId', { replacements: { profileId, kitId }, transaction: t })
  story.add(drawnUp, { workshopId: base.workshopId, actorId: author, action: 'profile.created', entityType: 'profile', entityId: profileId, data: { name: 'Baseline', kitId } })
  const baseline = await addVersions(seed, { ...base, id: null, spec: specTemplate }, people, { id: profileId, name: 'Baseline' }, kit.baseline)
  for (const c of kit.cars) {
    const spec = vehicleSpecSchema.parse({ ...specTemplate, ...c.spec })
    const intake = story.day(c.car.intakeDaysAgo, '08:30')
    const id = await insert(qi, t, `INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, "chassisNumber", registration, status, spec, "platformId", "kitId", "createdAt", "updatedAt")
      VALUES (:w, :stockRef, :make, :model, :year, :chassisNumber, :registration, :status, CAST(:spec AS jsonb), :platformId, :kitId, :intake, :intake) RETURNING id`,
    { w: base.workshopId, ...c.car, spec: JSON.stringify(spec), platformId, kitId, intake })
    const from = baseline[c.onBaselineNo - 1]!
    bookIn(story, { workshopId: base.workshopId, vehicleId: id, actorId: people[c.versions[0]!.author]! }, c.car, { kitId, kitName: kit.name, baselineVersionId: from.id, baselineVersionNo: c.onBaselineNo })
    const opened = profileOpened(story, c.versions[0]!)
    const carProfileId = await insert(qi, t, `INSERT INTO profiles ("workshopId", "vehicleId", name, "createdAt", "updatedAt") VALUES (:w, :id, 'Road', :opened, :opened) RETURNING id`, { w: base.workshopId, id, opened })
    story.add(opened, { workshopId: base.workshopId, vehicleId: id, actorId: people[c.versions[0]!.author]!, action: 'profile.created', entityType: 'profile', entityId: carProfileId, data: { name: 'Road' } })
    const made = await addVersions(seed, { ...base, id, spec }, people, { id: carProfileId, name: 'Road' }, c.versions)
    await qi.sequelize.query('UPDATE profile_versions SET "baselineVersionId" = :from WHERE id IN (:ids)', { replacements: { from: from.id, ids: made.map(m => m.id) }, transaction: t })
  }
}

export const up: MigrationFn<SeedContext> = async ({ context: seed }) => {
  const { qi, t } = seed
  const people = Object.fromEntries((await rows<{ email: string, id: number }>(qi, t, 'SELECT email, id FROM users')).map(u => [u.email, u.id]))
  for (const kit of demoKits) {
    const [base] = await rows<Base & { platformId: number }>(qi, t, `SELECT w.id AS "workshopId", w.settings, p.id AS "platformId", p.key, p.name, p."motorMaxRpm", p.schema
      FROM workshops w, platforms p WHERE w.name = 'Old Forge Electric Works' AND p.key = :key AND p."workshopId" IS NULL`, { key: kit.platformKey })
    if (!base) throw new Error(`the demo workshop or drive unit ${kit.platformKey} is missing: seed the demo workshop first`)
    await addKit(seed, base, people, kit, base.platformId)
  }
}

// Versions and their history are append-only by design.
export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('The demo kits cannot be un-seeded: versions and the audit chain are append-only. Drop the database instead.')
}
