import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { sha256Hex } from '../server/utils/history/audit'
import { canonicalJson } from '../shared/utils/canonical-json'
import { defaultParameters, findPlatform } from '../shared/platforms'
import { compareReadback } from '../shared/utils/readback-compare'
import { roadTestMoments, type SeedContext } from './demo-story'

// Demo read-backs: the handed-over Tregarth holds what was signed off; the Morrow in snagging has drifted
// (someone raised its lift-off regen at the roadside). Cars without a signed-off profile get a simple one first.
type Q = QueryInterface
const one = async <T extends object>(qi: Q, t: Transaction, sql: string, replacements: Record<string, unknown> = {}) =>
  (await qi.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: t }))[0]

async function person(qi: Q, t: Transaction, email: string) {
  return (await one<{ id: number }>(qi, t, 'SELECT id FROM users WHERE email = :email', { email }))!.id
}

type DemoCarRow = { id: number, workshopId: number, platformKey: string, createdAt: Date }
type OnCar = { profileId: number, versionId: number, parameters: Record<string, number>, versionNo: number, signedAt: Date }

async function ensureOnCar({ qi, t, story }: SeedContext, car: DemoCarRow, parameters: Record<string, number>, snag?: string): Promise<OnCar | null> {
  const existing = await one<Omit<OnCar, 'signedAt'> & { signedAt: string }>(qi, t,
    `SELECT p.id AS "profileId", v.id AS "versionId", v.parameters, v."versionNo", COALESCE((SELECT max(rt.signed->>'at') FROM road_tests rt WHERE rt."versionId" = v.id), to_jsonb(v."decidedAt") #>> '{}') AS "signedAt"
       FROM profiles p JOIN profile_versions v ON v.id = p."onCarVersionId" WHERE p."vehicleId" = :id ORDER BY p.id LIMIT 1`, { id: car.id })
  if (existing) return { ...existing, signedAt: new Date(existing.signedAt) }
  const any = await one(qi, t, 'SELECT 1 FROM profiles WHERE "vehicleId" = :id', { id: car.id })
  if (any) return null // someone else's demo profiles, not yet signed off: leave them be
  const [tuner, engineer, tester] = await Promise.all(['tuner', 'engineer', 'tester'].map(r => person(qi, t, `${r}@voltwright.test`)))
  // Drafted the day after the car came in, sent for review two hours later, approved the next morning.
  const created = story.after(new Date(car.createdAt), 25 * 60)
  const submitted = story.after(created, 120)
  const approved = story.after(created, 25 * 60)
  const { tested, signed } = roadTestMoments(story, approved)
  const base = { workshopId: car.workshopId, vehicleId: car.id }
  const profileId = (await one<{ id: number }>(qi, t, `INSERT INTO profiles ("workshopId", "vehicleId", name, "createdAt", "updatedAt") VALUES (:workshopId, :vehicleId, 'Road', :created, :created) RETURNING id`, { ...base, created }))!.id
  story.add(created, { ...base, actorId: tuner, action: 'profile.created', entityType: 'profile', entityId: profileId, data: { after: { name: 'Road' } } })
  const versionId = (await one<{ id: number }>(qi, t, `INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, rationale, "authorId", state, "contentHash", "submittedAt", "decidedAt", "createdAt", "updatedAt")
    VALUES (:workshopId, :profileId, 1, CAST(:parameters AS jsonb), 'First road setting for the chassis as built', :tuner, 'signed-off', :hash, :submitted, :approved, :created, :signed) RETURNING id`,
  { ...base, profileId, parameters: JSON.stringify(parameters), tuner, hash: sha256Hex(canonicalJson(parameters)), submitted, approved, created, signed }))!.id
  const version = { ...base, entityType: 'version', entityId: versionId }
  story.add(created, { ...version, actorId: tuner, action: 'version.created', data: { after: { versionNo: 1, parameters } } })
  story.add(submitted, { ...version, actorId: tuner, action: 'version.submitted', data: { patch: [{ op: 'replace', path: '/state', value: 'in-review' }], before: { state: 'draft' } } })
  await qi.sequelize.query(`INSERT INTO reviews ("workshopId", "versionId", "reviewerId", decision, comment, "createdAt") VALUES (:workshopId, :versionId, :engineer, 'approve', 'Regen within the wet grip limit; fine for the road test.', :approved)`, { replacements: { ...base, versionId, engineer, approved }, transaction: t })
  story.add(approved, { ...version, actorId: engineer, action: 'version.approved', data: { patch: [{ op: 'replace', path: '/state', value: 'approved' }], before: { state: 'in-review' } } })
  const roadTestId = (await one<{ id: number }>(qi, t, `INSERT INTO road_tests ("workshopId", "vehicleId", "versionId", "testerId", "testedAt", conditions, checks, verdict, "createdAt", "updatedAt")
    VALUES (:workshopId, :vehicleId, :versionId, :tester, :tested, CAST(:conditions AS jsonb), '[]', 'pass', :tested, :tested) RETURNING id`,
  { ...base, versionId, tester, tested, conditions: JSON.stringify({ surface: 'dry', ambientC: 11, route: 'Forge Lane hill and the bypass' }) }))!.id
  story.add(tested, { ...base, actorId: tester, action: 'road-test.recorded', entityType: 'road-test', entityId: roadTestId, data: { versionId, verdict: 'pass' } })
  await qi.sequelize.query('UPDATE profiles SET "onCarVersionId" = :versionId WHERE id = :profileId', { replacements: { versionId, profileId }, transaction: t })
  story.add(signed, { ...version, actorId: tester, action: 'version.signed-off', data: { patch: [{ op: 'replace', path: '/state', value: 'signed-off' }], before: { state: 'approved' }, roadTestId } })
  if (snag) {
    const snagId = (await one<{ id: number }>(qi, t, `INSERT INTO snags ("workshopId", "vehicleId", "roadTestId", kind, title, detail, "createdById", "createdAt", "updatedAt") VALUES (:workshopId, :vehicleId, :roadTestId, 'enhancement', :title, 'Offered to the owner at handover.', :tester, :signed, :signed) RETURNING id`, { ...base, roadTestId, title: snag, tester, signed }))!.id
    story.add(signed, { ...base, actorId: tester, action: 'snag.created', entityType: 'snag', entityId: snagId, data: { after: { kind: 'enhancement', title: snag } } })
  }
  return { profileId, versionId, parameters, versionNo: 1, signedAt: signed }
}

// A read-back on its day, or an hour after the settings were signed off onto the car if that came later.
async function readBack({ qi, t, story }: SeedContext, car: DemoCarRow, onCar: OnCar, found: Record<string, number>, day: Date) {
  const tester = await person(qi, t, 'tester@voltwright.test')
  const differences = compareReadback(onCar.parameters, found)
  const matches = differences.length === 0
  const at = new Date(Math.max(day.getTime(), story.after(onCar.signedAt, 60).getTime()))
  const id = (await one<{ id: number }>(qi, t, `INSERT INTO readbacks ("workshopId", "vehicleId", "profileId", "versionId", parameters, matches, differences, "recordedById", source, "readAt", "createdAt")
    VALUES (:workshopId, :vehicleId, :profileId, :versionId, CAST(:found AS jsonb), :matches, CAST(:differences AS jsonb), :tester, 'file', :at, :at) RETURNING id`,
  { workshopId: car.workshopId, vehicleId: car.id, profileId: onCar.profileId, versionId: onCar.versionId, found: JSON.stringify(found), matches, differences: JSON.stringify(differences), tester, at }))!.id
  const driftedAt = matches ? null : at.toISOString()
  if (driftedAt) await qi.sequelize.query('UPDATE vehicles SET "driftedAt" = :driftedAt WHERE id = :id', { replacements: { driftedAt, id: car.id }, transaction: t })
  story.add(at, { workshopId: car.workshopId, vehicleId: car.id, actorId: tester, action: matches ? 'readback.matched' : 'readback.differs', entityType: 'readback', entityId: id,
    data: { profileId: onCar.profileId, versionId: onCar.versionId, versionNo: onCar.versionNo, source: 'file', matches, differences, patch: driftedAt ? [{ op: 'add', path: '/driftedAt', value: driftedAt }] : [], before: { driftedAt: null } } })
}

export const up: MigrationFn<SeedContext> = async ({ context: seed }) => {
  const { qi, t, story } = seed
  const car = (ref: string) => one<DemoCarRow>(qi, t, `SELECT v.id, v."workshopId", p.key AS "platformKey", v."createdAt" FROM vehicles v JOIN platforms p ON p.id = v."platformId" WHERE v."stockRef" = :ref`, { ref })
  const tregarth = await car('OF-103')
  const morrow = await car('OF-104')
  if (tregarth) {
    const onCar = await ensureOnCar(seed, tregarth, { ...defaultParameters(findPlatform(tregarth.platformKey)!), powerCapKw: 30, creepTorqueNm: 0, liftOffRegenPct: 10 }, 'Period-correct rev counter reading motor speed')
    if (onCar) await readBack(seed, tregarth, onCar, onCar.parameters, story.day(55, '11:00')) // at its handover
  }
  if (morrow) {
    const onCar = await ensureOnCar(seed, morrow, { ...defaultParameters(findPlatform(morrow.platformKey)!), powerCapKw: 75 })
    if (onCar) await readBack(seed, morrow, onCar, { ...onCar.parameters, liftOffRegenPct: (onCar.parameters.liftOffRegenPct ?? 0) + 25 }, story.day(2, '15:00'))
  }
}

export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('Demo read-backs cannot be un-seeded: their history is append-only. Drop the database instead.')
}
