import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { approvedVersion, newCar, newClient, newProfile, passingChecks, recordRoadTest } from './road-test-fixtures'

const codes = (body: any) => body.data.missing.map((m: { code: string }) => m.code)

describe('sign-off', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const lead = await signIn('lead@voltwright.test') // engineer, tuner and tester at once
  const owner = await newClient(await signIn('admin@voltwright.test'))
  const client = await signIn(owner.email, 'owner-password-123')
  const clientId = owner.id
  const state = (id: number) => withDatabase(async c => (await c.query('SELECT state FROM profile_versions WHERE id = $1', [id])).rows[0].state)
  const onCar = (profileId: number) => withDatabase(async c => (await c.query('SELECT "onCarVersionId" FROM profiles WHERE id = $1', [profileId])).rows[0].onCarVersionId)

  async function setUp(checks = passingChecks(), verdict = 'pass') {
    const car = await newCar(tuner, { ownerUserId: clientId })
    const profileId = await newProfile(car.id)
    const versionId = await approvedVersion(profileId)
    const roadTestId = await recordRoadTest(tester, versionId, { checks, verdict })
    return { car, profileId, versionId, roadTestId }
  }

  it('signs the version off in one change: on the car, previous superseded, car moved on, audited, mailed', async () => {
    const { car, profileId, versionId, roadTestId } = await setUp()
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
    expect(await onCar(profileId)).toBe(versionId)
    const next = await approvedVersion(profileId)
    const rt2 = await recordRoadTest(tester, next)
    const res = await tester.call('POST', `/api/road-tests/${rt2}/sign-off`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ versionId: next, state: 'signed-off', supersededVersionId: versionId, vehicleStatus: 'handed-over' })
    expect(res.body.signed.contentHash).toMatch(/^[0-9a-f]{64}$/)
    expect(res.body.roadTest.signed.testerId).toBe(res.body.roadTest.tester.id)
    expect(await state(versionId)).toBe('superseded')
    expect(await state(next)).toBe('signed-off')
    expect(await onCar(profileId)).toBe(next)
    const events = await withDatabase(c => c.query('SELECT action, data FROM audit_events WHERE "vehicleId" = $1 AND action = $2 ORDER BY id', [car.id, 'version.signed-off']))
    expect(events.rows).toHaveLength(2)
    expect(events.rows[1].data).toMatchObject({ roadTestId: rt2, supersededVersionId: versionId, contentHash: res.body.signed.contentHash })
    const mail = await withDatabase(c => c.query('SELECT "to" FROM mail_outbox WHERE text LIKE $1 OR subject LIKE $1', [`%${car.stockRef}%`]))
    const to = mail.rows.map(r => r.to)
    expect(to).toContain('engineer@voltwright.test')
    expect(to).toContain('lead@voltwright.test')
    const ownerMail = await withDatabase(c => c.query('SELECT subject, text FROM mail_outbox WHERE "to" = $1 AND text LIKE $2', [owner.email, `%/cars/${car.id}/handover%`]))
    expect(ownerMail.rows.length).toBe(2)
  })

  it('moves the car to snagging when snags remain open, none blocking', async () => {
    const { car, roadTestId } = await setUp()
    await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'Door seal whistles above 80 km/h' })
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(res.body.vehicleStatus).toBe('snagging')
    expect((await tuner.call('GET', `/api/vehicles/${car.id}`)).body.status).toBe('snagging')
  })

  it('409 naming a failed verdict and each check that did not pass', async () => {
    const checks = passingChecks()
    checks[1] = { key: 'lift-off-regen', verdict: 'fail', values: { feel: 'harsh' }, note: 'Tail stepped out' } as never
    checks[3] = { key: 'creep', verdict: 'not-tested', values: {}, note: '' } as never
    const { versionId, roadTestId } = await setUp(checks, 'fail')
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(res.status).toBe(409)
    expect(codes(res.body)).toEqual(['verdict-not-pass', 'check-not-passed', 'check-not-passed'])
    expect(res.body.data.missing.filter((m: any) => m.check).map((m: any) => m.check)).toEqual(['lift-off-regen', 'creep'])
    expect(res.body.message).toContain('The creep check is not tested')
    expect(await state(versionId)).toBe('approved')
  })

  it('409 while a blocking snag is open, then signs once it is done', async () => {
    const { car, roadTestId } = await setUp()
    const snag = (await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'conversion', title: 'HV interlock loose', blocking: true, priority: 'urgent' })).body
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(res.status).toBe(409)
    expect(res.body.data.missing).toEqual([{ code: 'blocking-snags', snags: [{ id: snag.id, title: 'HV interlock loose' }], message: expect.stringContaining('HV interlock loose') }])
    await tester.call('PATCH', `/api/snags/${snag.id}`, { status: 'in-hand' })
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(409)
    await tester.call('PATCH', `/api/snags/${snag.id}`, { status: 'done' })
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
  })

  it('409 when the tester wrote the version (four eyes), and when someone other than the tester signs', async () => {
    const car = await newCar(tuner)
    const profileId = await newProfile(car.id)
    const own = await approvedVersion(profileId, { author: 'lead@voltwright.test' })
    const ownTest = await recordRoadTest(lead, own)
    const res = await lead.call('POST', `/api/road-tests/${ownTest}/sign-off`)
    expect(res.status).toBe(409)
    expect(codes(res.body)).toEqual(['tester-is-author'])
    const byTester = await recordRoadTest(tester, own)
    expect(codes((await lead.call('POST', `/api/road-tests/${byTester}/sign-off`)).body)).toEqual(['not-the-tester', 'tester-is-author'])
    expect((await tester.call('POST', `/api/road-tests/${byTester}/sign-off`)).status).toBe(200)
  })

  it('409 when the version is no longer approved, and when the road test is already signed', async () => {
    const { versionId, roadTestId } = await setUp()
    const second = await recordRoadTest(tester, versionId)
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
    const again = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(codes(again.body)).toEqual(['already-signed', 'version-not-approved'])
    const other = await tester.call('POST', `/api/road-tests/${second}/sign-off`)
    expect(codes(other.body)).toEqual(['version-not-approved'])
    expect(other.body.message).toContain('signed-off')
  })

  it('403 for a tuner or a car owner', async () => {
    const { roadTestId } = await setUp()
    expect((await tuner.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(403)
    expect((await client.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(403)
  })

  it('parallel sign-offs leave exactly one version on the car', async () => {
    const { profileId, versionId, roadTestId } = await setUp()
    const other = await approvedVersion(profileId)
    const otherTest = await recordRoadTest(tester, other)
    const sameTwice = await recordRoadTest(tester, other)
    const answers = await Promise.all([roadTestId, otherTest, sameTwice, roadTestId].map(id => tester.call('POST', `/api/road-tests/${id}/sign-off`)))
    const ok = answers.filter(a => a.status === 200)
    expect(answers.every(a => a.status === 200 || a.status === 409)).toBe(true)
    expect(ok.length).toBe(2) // one per version; the duplicates are refused
    const signed = await withDatabase(c => c.query('SELECT id FROM profile_versions WHERE "profileId" = $1 AND state = \'signed-off\'', [profileId]))
    expect(signed.rows).toHaveLength(1)
    expect(await onCar(profileId)).toBe(signed.rows[0].id)
    const states = [await state(versionId), await state(other)].sort()
    expect(states).toEqual(['signed-off', 'superseded'])
  })

  it('the database itself refuses a second signed-off version of a profile', async () => {
    const { profileId, roadTestId } = await setUp()
    await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    const other = await approvedVersion(profileId)
    await expect(withDatabase(c => c.query('UPDATE profile_versions SET state = \'signed-off\' WHERE id = $1', [other]))).rejects.toThrow(/profile_versions_one_signed_off/)
  })
})
