import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { approvedVersion, newCar, newProfile, passingChecks, recordRoadTest, roadTestBody } from './road-test-fixtures'
import { allJustified } from './version-fixtures'

await useRunningServer()

describe('road tests', async () => {
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const car = await newCar(tuner)
  const profileId = await newProfile(car.id)
  const versionId = await approvedVersion(profileId)

  it('records a road test of an approved version, audits it and moves the car to road testing', async () => {
    const res = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody())
    expect(res.status).toBe(201)
    expect(res.body.verdict).toBe('pass')
    expect(res.body.checks.map((c: { key: string }) => c.key)).toEqual(['hill-start', 'lift-off-regen', 'brake-regen', 'creep', 'full-power', 'thermal-soak'])
    expect(res.body.checks[0].values).toEqual({ gradientPct: 18, rollbackMm: 60 })
    expect(res.body.signed).toBeNull()
    const read = await tester.call('GET', `/api/road-tests/${res.body.id}`)
    expect(read.body.conditions).toEqual({ surface: 'dry', ambientC: 14, route: 'Forge loop with Quarry Lane' })
    expect(read.body.vehicle.status).toBe('road-testing')
    const events = await withDatabase(c => c.query('SELECT action FROM audit_events WHERE "vehicleId" = $1 ORDER BY id', [car.id]))
    expect(events.rows.map(r => r.action)).toEqual(['vehicle.created', 'profile.created', 'version.created', 'version.submitted', 'version.approved', 'vehicle.status-changed', 'road-test.recorded'])
    const list = await auditor.call('GET', `/api/vehicles/${car.id}/road-tests`)
    expect(list.body.items[0]).toMatchObject({ id: res.body.id, verdict: 'pass', signed: false, failedChecks: [] })
  })

  it('records a send repeated with the same key once, in parallel or one after the other, and only for its version', async () => {
    const v = await approvedVersion(await newProfile((await newCar(tuner)).id))
    const key = crypto.randomUUID()
    const body = { ...roadTestBody(), idempotencyKey: key }
    const [a, b] = await Promise.all([tester.call('POST', `/api/versions/${v}/road-tests`, body), tester.call('POST', `/api/versions/${v}/road-tests`, body)])
    expect([a.status, b.status].sort()).toEqual([200, 201])
    expect(a.body.id).toBe(b.body.id)
    const again = await tester.call('POST', `/api/versions/${v}/road-tests`, body)
    expect(again.status).toBe(200)
    expect(again.body.id).toBe(a.body.id)
    const rows = await withDatabase(c => c.query('SELECT count(*)::int AS n FROM road_tests WHERE "idempotencyKey" = $1', [key]))
    expect(rows.rows[0].n).toBe(1)
    const events = await withDatabase(c => c.query('SELECT count(*)::int AS n FROM audit_events WHERE action = $1 AND "entityId" = $2', ['road-test.recorded', String(a.body.id)]))
    expect(events.rows[0].n).toBe(1)
    expect((await tester.call('POST', `/api/versions/${versionId}/road-tests`, body)).status).toBe(409) // the key belongs to another version's record
    expect((await tester.call('POST', `/api/versions/${v}/road-tests`, { ...roadTestBody(), idempotencyKey: 'not-a-key' })).status).toBe(400)
  })

  it('refuses a version that is not approved, naming its state', async () => {
    const draft = await approvedVersion(profileId, { state: 'in-review' })
    const res = await tester.call('POST', `/api/versions/${draft}/road-tests`, roadTestBody())
    expect(res.status).toBe(409)
    expect(res.body.message).toContain('in-review')
    expect(res.body.data.state).toBe('in-review')
  })

  it('takes a road test dated between the version\'s approval and now, and refuses any other date with a plain message', async () => {
    const approvedAt = new Date((await tester.call('GET', `/api/versions/${versionId}`)).body.decidedAt)
    const early = await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), testedAt: new Date(approvedAt.getTime() - 60_000).toISOString() })
    expect(early.status).toBe(400)
    expect(early.body.message).toContain('before version')
    expect(early.body.data.fields[0].path).toBe('testedAt')
    const future = await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), testedAt: new Date(Date.now() + 60 * 60_000).toISOString() })
    expect(future.status).toBe(400)
    expect(future.body.message).toContain('in the future')
    const years = await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), testedAt: '1999-06-01T10:00:00Z' })
    expect(years.status).toBe(400)
    const between = new Date(Math.min(approvedAt.getTime() + 1000, Date.now()))
    const ok = await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), testedAt: between.toISOString() })
    expect(ok.status).toBe(201)
    expect(ok.body.testedAt).toBe(between.toISOString())
    // A phone's clock a minute ahead of the server's is let through.
    expect((await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), testedAt: new Date(Date.now() + 60_000).toISOString() })).status).toBe(201)
  })

  it('names each missing or wrong part of the record', async () => {
    const noHill = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({ checks: passingChecks().slice(1) }))
    expect(noHill.status).toBe(400)
    expect(noHill.body.data.fields).toContainEqual({ path: 'checks', message: 'The hill start check is missing' })
    const checks = passingChecks()
    checks[0] = { key: 'hill-start', verdict: 'pass', values: { gradientPct: 18 } as never, note: '' }
    checks[5] = { key: 'thermal-soak', verdict: 'fail', values: { motorC: 130, inverterC: 70, batteryC: 40 }, note: 'Motor hot' }
    const res = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({ checks }))
    expect(res.status).toBe(400)
    const paths = res.body.data.fields.map((f: { path: string }) => f.path)
    expect(paths).toContain('checks.0.values.rollbackMm')
    expect(paths).toContain('verdict')
    const bad = await tester.call('POST', `/api/versions/${versionId}/road-tests`, { ...roadTestBody(), conditions: { surface: 'gravel', ambientC: 99 } })
    expect(bad.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['conditions.ambientC', 'conditions.surface'])
  })

  it('is for testers of the workshop only', async () => {
    expect((await tuner.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody())).status).toBe(403)
    expect((await client.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody())).status).toBe(403)
    const id = await recordRoadTest(tester, versionId)
    expect((await client.call('GET', `/api/road-tests/${id}`)).status).toBe(403)
    expect((await otherAdmin.call('GET', `/api/road-tests/${id}`)).status).toBe(404)
    expect((await tester.call('GET', '/api/road-tests/999999')).status).toBe(404)
  })

  it('lists approved versions awaiting a road test for the tester\'s bench', async () => {
    const res = await tester.call('GET', '/api/road-tests/awaiting')
    expect(res.status).toBe(200)
    const mine = res.body.items.find((i: { versionId: number }) => i.versionId === versionId)
    expect(mine.vehicle.id).toBe(car.id)
    expect(mine.roadTests).toBeGreaterThanOrEqual(1)
    expect((await tuner.call('GET', '/api/road-tests/awaiting')).status).toBe(403)
  })
})

describe('roadside changes', async () => {
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner)
  const profileId = await newProfile(car.id)
  const versionId = await approvedVersion(profileId)
  const roadTestId = await recordRoadTest(tester, versionId)
  const tested = await withDatabase(async c => (await c.query('SELECT parameters FROM profile_versions WHERE id = $1', [versionId])).rows[0].parameters)

  it('records the change as the next version, from the roadside, in review, and mails the engineers', async () => {
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: { ...tested, liftOffRegenPct: tested.liftOffRegenPct - 5 }, rationale: 'Lift-off felt abrupt on the wet bend', justifications: allJustified() })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ versionNo: 2, parentVersionId: versionId, state: 'in-review', origin: 'roadside', roadTestId, profileId })
    expect(res.body.contentHash).toMatch(/^[0-9a-f]{64}$/)
    const mail = await withDatabase(c => c.query('SELECT "to", subject FROM mail_outbox WHERE subject LIKE $1', [`%${car.stockRef}%v2`]))
    expect(mail.rows.map(r => r.to)).toContain('engineer@voltwright.test')
    const view = await tester.call('GET', `/api/road-tests/${roadTestId}`)
    expect(view.body.roadsideVersions).toEqual([{ id: res.body.id, versionNo: 2, state: 'in-review' }])
  })

  it('numbers parallel roadside changes without gaps or duplicates', async () => {
    const answers = await Promise.all([1, 2, 3].map(i => tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: { ...tested, creepTorqueNm: tested.creepTorqueNm - i }, rationale: `Creep try ${i}`, justifications: allJustified() })))
    expect(answers.map(a => a.status)).toEqual([201, 201, 201])
    expect(answers.map(a => a.body.versionNo).sort()).toEqual([3, 4, 5])
  })

  it('refuses unchanged settings, settings out of range and a tuner', async () => {
    const same = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: tested, rationale: 'No change' })
    expect(same.status).toBe(400)
    const wild = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: { ...tested, powerCapKw: 9999 }, rationale: 'More' })
    expect(wild.status).toBe(400)
    expect(wild.body.data.fields.map((f: { path: string }) => f.path)).toContain('parameters.powerCapKw')
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: tested })).body.data.fields[0].path).toBe('rationale')
    expect((await tuner.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: { ...tested, creepTorqueNm: 1 }, rationale: 'x' })).status).toBe(403)
  })
})
