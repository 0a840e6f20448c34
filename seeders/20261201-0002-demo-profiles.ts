import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { defaultParameters } from '../shared/platforms'
import type { SettingValues } from '../shared/compute/parameter-input'
import { jsonPatch } from '../shared/utils/json-patch'
import { evaluateOnServer, settingsOf } from '../server/utils/platforms/evaluation'
import { snapshotOf, versionContentHash } from '../server/utils/versions/content'
import type { VehicleSpec } from '../shared/schemas/vehicle-spec'
import { demoProfiles, type DemoProfile, type DemoVersion } from './demo-profiles'
import { roadTestMoments, type DemoStory, type SeedContext } from './demo-story'

// A version as made: its id and settings, the next one's parent.
export type Made = { id: number, parameters: SettingValues }

// id: the car's, or null for a kit's baseline (its events belong to no car).
export interface Car { id: number | null, workshopId: number, spec: VehicleSpec, key: string, name: string, motorMaxRpm: number, schema: unknown, settings: unknown }

export async function rows<T extends object>(qi: QueryInterface, t: Transaction, sql: string, replacements: Record<string, unknown> = {}) {
  return qi.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: t })
}

// A version created on its day, sent for review two hours later and decided the next morning (docs/history.md#the-demo-history).
export async function addVersion({ qi, t, story }: SeedContext, car: Car, people: Record<string, number>, profile: { id: number, name: string }, no: number, parent: Made | null, v: DemoVersion) {
  const platform = { key: car.key, name: car.name, motorMaxRpm: car.motorMaxRpm, schema: car.schema }
  const parameters = { ...defaultParameters(platform), ...v.parameters }
  const authorId = people[v.author]!
  const content = { profileId: profile.id, versionNo: no, parentVersionId: parent?.id ?? null, parameters, rationale: v.rationale, authorId, origin: 'workshop' as const }
  const createdAt = story.day(v.daysAgo, '09:30')
  const submittedAt = v.state === 'draft' ? null : story.after(createdAt, 120)
  const decidedAt = v.review ? story.after(createdAt, 25 * 60) : null
  const evaluation = submittedAt ? snapshotOf(evaluateOnServer(car.spec, platform, parameters, settingsOf({ settings: car.settings as Record<string, unknown> })), submittedAt) : null
  const contentHash = versionContentHash(content)
  const [row] = await rows<{ id: number }>(qi, t, `INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", "parentVersionId", parameters, rationale, "authorId", state, origin, evaluation, justifications, "contentHash", "submittedAt", "decidedAt", "createdAt", "updatedAt")
    VALUES (:workshopId, :profileId, :versionNo, :parentVersionId, CAST(:parameters AS jsonb), :rationale, :authorId, :state, 'workshop', CAST(:evaluation AS jsonb), CAST(:justifications AS jsonb), :contentHash, :submittedAt, :decidedAt, :createdAt, :updatedAt) RETURNING id`,
  { ...content, workshopId: car.workshopId, parameters: JSON.stringify(parameters), state: v.state, evaluation: evaluation ? JSON.stringify(evaluation) : null, justifications: JSON.stringify(v.justifications ?? {}), contentHash, submittedAt, decidedAt, createdAt, updatedAt: decidedAt ?? submittedAt ?? createdAt })
  const id = row!.id
  const event = (at: Date, actorId: number, action: string, data: Record<string, unknown>) =>
    story.add(at, { workshopId: car.workshopId, vehicleId: car.id, actorId, action, entityType: 'version', entityId: id, data: { versionNo: no, ...data } })
  event(createdAt, authorId, 'version.created', { profileId: profile.id, profileName: profile.name, parentVersionId: parent?.id ?? null, origin: 'workshop', contentHash, parameters, patchFromParent: parent ? jsonPatch(parent.parameters, parameters) : null })
  if (evaluation) {
    const dangers = evaluation.warnings.filter(w => w.severity === 'danger')
    const missing = dangers.filter(w => !v.justifications?.[w.rule])
    if (!evaluation.valid || missing.length) throw new Error(`demo version ${profile.name} v${no} could not be submitted: ${JSON.stringify([...evaluation.errors, ...missing])}`)
    event(submittedAt!, authorId, 'version.submitted', { contentHash, dangerCount: dangers.length, warnings: evaluation.warnings.map(w => ({ rule: w.rule, severity: w.severity })), justifications: v.justifications ?? {} })
  }
  if (v.review) {
    const reviewerId = people[v.review.by]!
    const [review] = await rows<{ id: number }>(qi, t, `INSERT INTO reviews ("workshopId", "versionId", "reviewerId", decision, comment, "createdAt") VALUES (:w, :id, :reviewerId, :decision, :comment, :decidedAt) RETURNING id`,
      { w: car.workshopId, id, reviewerId, decision: v.review.decision, comment: v.review.comment, decidedAt })
    event(decidedAt!, reviewerId, v.review.decision === 'approve' ? 'version.approved' : 'version.rejected', { reviewId: review!.id, comment: v.review.comment, contentHash })
  }
  if (v.state === 'signed-off') {
    // When the road test seeder (20261201-0003) signs the drive it records: after the road test, as the server requires.
    event(roadTestMoments(story, decidedAt!).signed, people['tester@voltwright.test']!, 'version.signed-off', { contentHash })
  }
  return { id, parameters }
}

// A profile opened just before its first version.
export const profileOpened = (story: DemoStory, first: DemoVersion) => story.day(first.daysAgo, '09:25')

async function addProfile(seed: SeedContext, car: Car, people: Record<string, number>, p: DemoProfile) {
  const { qi, t, story } = seed
  const at = profileOpened(story, p.versions[0]!)
  const [profile] = await rows<{ id: number }>(qi, t, `INSERT INTO profiles ("workshopId", "vehicleId", name, "createdAt", "updatedAt") VALUES (:w, :v, :name, :at, :at) RETURNING id`,
    { w: car.workshopId, v: car.id, name: p.name, at })
  const ref = { id: profile!.id, name: p.name }
  story.add(at, { workshopId: car.workshopId, vehicleId: car.id, actorId: people[p.versions[0]!.author]!, action: 'profile.created', entityType: 'profile', entityId: ref.id, data: { name: p.name } })
  let parent: Made | null = null
  const ids: number[] = []
  for (const [i, v] of p.versions.entries()) {
    parent = await addVersion(seed, car, people, ref, i + 1, parent, v)
    ids.push(parent.id)
  }
  if (p.onCarVersionNo) await qi.sequelize.query('UPDATE profiles SET "onCarVersionId" = :id WHERE id = :p', { replacements: { id: ids[p.onCarVersionNo - 1], p: ref.id }, transaction: t })
}

export const up: MigrationFn<SeedContext> = async ({ context: seed }) => {
  const { qi, t } = seed
  const people = Object.fromEntries((await rows<{ email: string, id: number }>(qi, t, 'SELECT email, id FROM users')).map(u => [u.email, u.id]))
  for (const p of demoProfiles) {
    const [car] = await rows<Car>(qi, t, `SELECT v.id, v."workshopId", v.spec, p.key, p.name, p."motorMaxRpm", p.schema, w.settings
      FROM vehicles v JOIN platforms p ON p.id = v."platformId" JOIN workshops w ON w.id = v."workshopId" WHERE v."stockRef" = :ref AND w.name = 'Old Forge Electric Works'`, { ref: p.stockRef })
    if (!car) throw new Error(`demo car ${p.stockRef} is missing: seed the demo workshop first`)
    await addProfile(seed, car, people, p)
  }
}

// Versions and their history are append-only by design.
export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('The demo profiles cannot be un-seeded: versions and the audit chain are append-only. Drop the database instead.')
}
