import type { MigrationFn } from 'umzug'
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'
import { sha256Hex } from '../server/utils/history/audit'
import { canonicalJson } from '../shared/utils/canonical-json'
import { roadTestRecordContent } from '../shared/utils/road-test-record'
import { demoRoadTests, demoSnags } from './demo-road-tests'
import { roadTestMoments, type SeedContext } from './demo-story'

// Road tests for the demo cars whose versions are signed off, and a snag list of each kind. Profiles come
// from the demo-profiles seeder; whatever is absent is skipped, so this works with or without it.
type Row = Record<string, any> // eslint-disable-line @typescript-eslint/no-explicit-any -- raw SQL rows
const select = (qi: QueryInterface, t: Transaction, sql: string, replacements: Record<string, unknown>) =>
  qi.sequelize.query<Row>(sql, { replacements, type: QueryTypes.SELECT, transaction: t })

export const up: MigrationFn<SeedContext> = async ({ context: { qi, t, story } }) => {
  const people = Object.fromEntries((await select(qi, t, 'SELECT id, email FROM users', {})).map(u => [u.email, u.id]))
  const tester = people['tester@voltwright.test']
  if (!tester) return
  for (const rt of demoRoadTests) {
    const [v] = await select(qi, t, `SELECT pv.id, pv."contentHash", pv."decidedAt", pv."createdAt", veh.id AS "vehicleId", veh."workshopId" FROM profile_versions pv
      JOIN profiles p ON p.id = pv."profileId" JOIN vehicles veh ON veh.id = p."vehicleId"
      WHERE veh."stockRef" = :stockRef AND p.name = :profile AND pv."versionNo" = :versionNo AND pv.state IN ('signed-off', 'superseded')`, rt)
    if (!v) continue
    const { tested: testedAt, signed: signedAt } = roadTestMoments(story, new Date(v.decidedAt))
    const [row] = await select(qi, t, `INSERT INTO road_tests ("workshopId", "vehicleId", "versionId", "testerId", "testedAt", conditions, checks, verdict, "createdAt", "updatedAt")
      VALUES (:w, :vehicle, :version, :tester, :at, CAST(:conditions AS jsonb), CAST(:checks AS jsonb), 'pass', :at, :at) RETURNING id`,
    { w: v.workshopId, vehicle: v.vehicleId, version: v.id, tester, at: testedAt, conditions: JSON.stringify(rt.conditions), checks: JSON.stringify(rt.checks) })
    const contentHash = sha256Hex(canonicalJson(roadTestRecordContent({ roadTestId: row!.id, vehicleId: v.vehicleId, versionId: v.id, versionContentHash: v.contentHash, testerId: tester, testedAt, conditions: rt.conditions, checks: rt.checks, verdict: 'pass', telemetry: [], files: [], signedAt })))
    await qi.sequelize.query('UPDATE road_tests SET signed = CAST(:signed AS jsonb) WHERE id = :id', { replacements: { id: row!.id, signed: JSON.stringify({ testerId: tester, at: signedAt.toISOString(), contentHash }) }, transaction: t })
    story.add(testedAt, { workshopId: v.workshopId, vehicleId: v.vehicleId, actorId: tester, action: 'road-test.recorded', entityType: 'road-test', entityId: row!.id, data: { versionId: v.id, verdict: 'pass', conditions: rt.conditions, checks: rt.checks.map(c => ({ key: c.key, verdict: c.verdict, values: c.values })), signed: { contentHash } } })
  }
  for (const s of demoSnags) {
    const [car] = await select(qi, t, 'SELECT id, "workshopId" FROM vehicles WHERE "stockRef" = :stockRef', s)
    if (!car) continue
    const at = story.day(s.daysAgo, s.time)
    const [row] = await select(qi, t, `INSERT INTO snags ("workshopId", "vehicleId", kind, title, detail, priority, status, "assigneeId", blocking, "createdById", "createdAt", "updatedAt")
      VALUES (:w, :v, :kind, :title, :detail, :priority, :status, :assignee, :blocking, :by, :at, :at) RETURNING id`,
    { w: car.workshopId, v: car.id, ...s, assignee: s.assignee ? people[s.assignee] ?? null : null, by: tester, at })
    const event = { workshopId: car.workshopId, vehicleId: car.id, entityType: 'snag', entityId: row!.id }
    // Raised open (and unassigned unless it was given to someone then); taken in hand or closed a day later, by its assignee.
    story.add(at, { ...event, actorId: tester, action: 'snag.created', data: { after: { kind: s.kind, title: s.title, priority: s.priority, status: 'open', blocking: s.blocking, assigneeId: s.assignee ? people[s.assignee] ?? null : null } } })
    if (s.status !== 'open') story.add(story.after(at, Math.min(24 * 60, s.daysAgo * 12 * 60)), { ...event, actorId: (s.assignee && people[s.assignee]) || tester, action: 'snag.updated', data: { patch: [{ op: 'test', path: '/status', value: 'open' }, { op: 'replace', path: '/status', value: s.status }] } })
  }
}

// Demo data goes with the database; its audit events cannot be deleted by design.
export const down: MigrationFn<SeedContext> = async () => {
  throw new Error('Demo road tests cannot be un-seeded: their history is append-only. Drop the database instead.')
}
