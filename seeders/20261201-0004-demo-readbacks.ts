import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { appendAuditEvent, sha256Hex } from '../server/utils/history/audit'
import { canonicalJson } from '../shared/utils/canonical-json'
import { defaultParameters, findPlatform } from '../shared/platforms'
import { compareReadback } from '../shared/utils/readback-compare'

// Demo read-backs: the handed-over Tregarth holds what was signed off; the Morrow in snagging has drifted
// (someone raised its lift-off regen at the roadside). Cars without a signed-off profile get a simple one first.
type Q = QueryInterface
const one = async <T>(qi: Q, t: Transaction, sql: string, replacements: Record<string, unknown> = {}) =>
  (await qi.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: t }))[0]

async function person(qi: Q, t: Transaction, email: string) {
  return (await one<{ id: number }>(qi, t, 'SELECT id FROM users WHERE email = :email', { email }))!.id
}

async function ensureOnCar(qi: Q, t: Transaction, car: { id: number, workshopId: number, platformKey: string }, parameters: Record<string, number>, snag?: string) {
  const existing = await one<{ profileId: number, versionId: number, parameters: Record<string, number>, versionNo: number }>(qi, t,
    `SELECT p.id AS "profileId", v.id AS "versionId", v.parameters, v."versionNo" FROM profiles p JOIN profile_versions v ON v.id = p."onCarVersionId" WHERE p."vehicleId" = :id ORDER BY p.id LIMIT 1`, { id: car.id })
  if (existing) return existing
  const any = await one(qi, t, 'SELECT 1 FROM profiles WHERE "vehicleId" = :id', { id: car.id })
  if (any) return null // someone else's demo profiles, not yet signed off: leave them be
  const [tuner, engineer, tester] = await Promise.all(['tuner', 'engineer', 'tester'].map(r => person(qi, t, `${r}@voltwright.test`)))
  const base = { workshopId: car.workshopId, vehicleId: car.id }
  const profileId = (await one<{ id: number }>(qi, t, `INSERT INTO profiles ("workshopId", "vehicleId", name) VALUES (:workshopId, :vehicleId, 'Road') RETURNING id`, base))!.id
  await appendAuditEvent(t, { ...base, actorId: tuner, action: 'profile.created', entityType: 'profile', entityId: profileId, data: { after: { name: 'Road' } } })
  const versionId = (await one<{ id: number }>(qi, t, `INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, rationale, "authorId", state, "contentHash", "submittedAt", "decidedAt")
    VALUES (:workshopId, :profileId, 1, CAST(:parameters AS jsonb), 'First road setting for the chassis as built', :tuner, 'signed-off', :hash, now(), now()) RETURNING id`,
  { ...base, profileId, parameters: JSON.stringify(parameters), tuner, hash: sha256Hex(canonicalJson(parameters)) }))!.id
  const version = { ...base, entityType: 'version', entityId: versionId }
  await appendAuditEvent(t, { ...version, actorId: tuner, action: 'version.created', data: { after: { versionNo: 1, parameters } } })
  await appendAuditEvent(t, { ...version, actorId: tuner, action: 'version.submitted', data: { patch: [{ op: 'replace', path: '/state', value: 'in-review' }], before: { state: 'draft' } } })
  await qi.sequelize.query(`INSERT INTO reviews ("workshopId", "versionId", "reviewerId", decision, comment) VALUES (:workshopId, :versionId, :engineer, 'approve', 'Regen within the wet grip limit; fine for the road test.')`, { replacements: { ...base, versionId, engineer }, transaction: t })
  await appendAuditEvent(t, { ...version, actorId: engineer, action: 'version.approved', data: { patch: [{ op: 'replace', path: '/state', value: 'approved' }], before: { state: 'in-review' } } })
  const roadTestId = (await one<{ id: number }>(qi, t, `INSERT INTO road_tests ("workshopId", "vehicleId", "versionId", "testerId", "testedAt", conditions, checks, verdict)
    VALUES (:workshopId, :vehicleId, :versionId, :tester, now() - interval '20 days', CAST(:conditions AS jsonb), '[]', 'pass') RETURNING id`,
  { ...base, versionId, tester, conditions: JSON.stringify({ surface: 'dry', ambientC: 11, route: 'Forge Lane hill and the bypass' }) }))!.id
  await appendAuditEvent(t, { ...base, actorId: tester, action: 'road-test.recorded', entityType: 'road-test', entityId: roadTestId, data: { versionId, verdict: 'pass' } })
  await qi.sequelize.query('UPDATE profiles SET "onCarVersionId" = :versionId WHERE id = :profileId', { replacements: { versionId, profileId }, transaction: t })
  await appendAuditEvent(t, { ...version, actorId: tester, action: 'version.signed-off', data: { patch: [{ op: 'replace', path: '/state', value: 'signed-off' }], before: { state: 'approved' }, roadTestId } })
  if (snag) {
    const snagId = (await one<{ id: number }>(qi, t, `INSERT INTO snags ("workshopId", "vehicleId", "roadTestId", kind, title, detail, "createdById") VALUES (:workshopId, :vehicleId, :roadTestId, 'enhancement', :title, 'Offered to the owner at handover.', :tester) RETURNING id`, { ...base, roadTestId, title: snag, tester }))!.id
    await appendAuditEvent(t, { ...base, actorId: tester, action: 'snag.created', entityType: 'snag', entityId: snagId, data: { after: { kind: 'enhancement', title: snag } } })
  }
  return { profileId, versionId, parameters, versionNo: 1 }
}

async function readBack(qi: Q, t: Transaction, car: { id: number, workshopId: number, platformKey: string }, onCar: { profileId: number, versionId: number, parameters: Record<string, number>, versionNo: number }, found: Record<string, number>) {
  const tester = await person(qi, t, 'tester@voltwright.test')
  const differences = compareReadback(onCar.parameters, found)
  const matches = differences.length === 0
  const id = (await one<{ id: number, createdAt: Date }>(qi, t, `INSERT INTO readbacks ("workshopId", "vehicleId", "profileId", "versionId", parameters, matches, differences, "recordedById", source, "readAt")
    VALUES (:workshopId, :vehicleId, :profileId, :versionId, CAST(:found AS jsonb), :matches, CAST(:differences AS jsonb), :tester, 'file', now()) RETURNING id, "createdAt"`,
  { workshopId: car.workshopId, vehicleId: car.id, profileId: onCar.profileId, versionId: onCar.versionId, found: JSON.stringify(found), matches, differences: JSON.stringify(differences), tester }))!
  const driftedAt = matches ? null : new Date(id.createdAt).toISOString()
  if (driftedAt) await qi.sequelize.query('UPDATE vehicles SET "driftedAt" = :driftedAt WHERE id = :id', { replacements: { driftedAt, id: car.id }, transaction: t })
  await appendAuditEvent(t, { workshopId: car.workshopId, vehicleId: car.id, actorId: tester, action: matches ? 'readback.matched' : 'readback.differs', entityType: 'readback', entityId: id.id,
    data: { profileId: onCar.profileId, versionId: onCar.versionId, versionNo: onCar.versionNo, source: 'file', matches, differences, patch: driftedAt ? [{ op: 'add', path: '/driftedAt', value: driftedAt }] : [], before: { driftedAt: null } } })
}

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.transaction(async (t) => {
    const car = (ref: string) => one<{ id: number, workshopId: number, platformKey: string }>(qi, t, `SELECT v.id, v."workshopId", p.key AS "platformKey" FROM vehicles v JOIN platforms p ON p.id = v."platformId" WHERE v."stockRef" = :ref`, { ref })
    const tregarth = await car('OF-103')
    const morrow = await car('OF-104')
    if (tregarth) {
      const onCar = await ensureOnCar(qi, t, tregarth, { ...defaultParameters(findPlatform(tregarth.platformKey)!), powerCapKw: 30, creepTorqueNm: 0, liftOffRegenPct: 10 }, 'Period-correct rev counter reading motor speed')
      if (onCar) await readBack(qi, t, tregarth, onCar, onCar.parameters)
    }
    if (morrow) {
      const onCar = await ensureOnCar(qi, t, morrow, { ...defaultParameters(findPlatform(morrow.platformKey)!), powerCapKw: 75 })
      if (onCar) await readBack(qi, t, morrow, onCar, { ...onCar.parameters, liftOffRegenPct: (onCar.parameters.liftOffRegenPct ?? 0) + 25 })
    }
  })
}

export const down: MigrationFn<QueryInterface> = async () => {
  throw new Error('Demo read-backs cannot be un-seeded: their history is append-only. Drop the database instead.')
}
