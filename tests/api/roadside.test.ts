// A roadside change goes through the same version lifecycle as any other (docs/version-lifecycle.md): only the
// tester who drove an open road test, the same insert and the same submit, every danger justified.
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { PLATFORM, approvedVersion, newCar, newProfile, recordRoadTest } from './road-test-fixtures'

await useRunningServer()

describe('roadside changes in the version lifecycle', async () => {
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const lead = await signIn('lead@voltwright.test') // engineer, tuner and tester at once: may road-test, did not drive this one
  const engineer = await signIn('engineer@voltwright.test')

  async function openRoadTest() {
    const car = await newCar(tuner)
    const profileId = await newProfile(car.id)
    const versionId = await approvedVersion(profileId)
    const roadTestId = await recordRoadTest(tester, versionId)
    const tested = (await tester.call('GET', `/api/versions/${versionId}`)).body.parameters as Record<string, number>
    // Strong lift-off regen on this rear-driven car: beyond the rear axle's grip, a danger.
    const risky = { ...tested, regenTorqueLimitNm: 200, liftOffRegenPct: 90 }
    const evaluation = await tester.call('POST', '/api/evaluate', { vehicleId: car.id, platformKey: PLATFORM, parameters: risky })
    const dangers = [...new Set<string>(evaluation.body.warnings.filter((w: { severity: string }) => w.severity === 'danger').map((w: { rule: string }) => w.rule))]
    expect(dangers.length).toBeGreaterThan(0)
    return { car, profileId, versionId, roadTestId, tested, risky, dangers }
  }
  const stored = (carId: number) => withDatabase(async c => ({
    versions: (await c.query('SELECT count(*)::int AS n FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId" WHERE p."vehicleId" = $1', [carId])).rows[0].n,
    events: (await c.query('SELECT count(*)::int AS n FROM audit_events WHERE "vehicleId" = $1', [carId])).rows[0].n
  }))
  const reasons = (rules: string[]) => Object.fromEntries(rules.map(r => [r, `Only for the dry-weather road test of ${r}; the tester holds the car in a straight line.`]))

  it('refuses a danger without a written justification, naming the rule, and stores nothing', async () => {
    const { car, roadTestId, risky, dangers } = await openRoadTest()
    const before = await stored(car.id)
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'More lift-off regen for the long descent' })
    expect(res.status).toBe(400)
    for (const rule of dangers) expect(res.body.message).toContain(rule)
    expect(res.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(dangers.map(r => `justifications.${r}`).sort())
    // One justification short is still refused.
    const short = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'More lift-off regen', justifications: reasons(dangers.slice(1)) })
    expect(short.status).toBe(400)
    expect(short.body.message).toContain(dangers[0])
    expect(await stored(car.id)).toEqual(before)
  })

  it('refuses another tester than the one who drove the road test (403)', async () => {
    const { car, roadTestId, risky, dangers } = await openRoadTest()
    const before = await stored(car.id)
    const res = await lead.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'Not my drive', justifications: reasons(dangers) })
    expect(res.status).toBe(403)
    expect(res.body.message).toContain('drove this road test')
    expect(await stored(car.id)).toEqual(before)
  })

  it('refuses once the road test is signed off (409): it is closed', async () => {
    const { car, roadTestId, risky, dangers } = await openRoadTest()
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
    const before = await stored(car.id)
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'After the fact', justifications: reasons(dangers) })
    expect(res.status).toBe(409)
    expect(res.body.message).toContain('signed-off')
    expect(await stored(car.id)).toEqual(before)
  })

  it('refuses a road test of a version that is no longer approved (another road test signed it off)', async () => {
    const { versionId, roadTestId, risky, dangers } = await openRoadTest()
    const second = await recordRoadTest(tester, versionId)
    expect((await tester.call('POST', `/api/road-tests/${second}/sign-off`)).status).toBe(200)
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'Too late', justifications: reasons(dangers) })
    expect(res.status).toBe(409)
  })

  it('with every danger justified: one draft made and sent in one go, justifications kept and shown to the reviewer', async () => {
    const { car, profileId, versionId, roadTestId, risky, dangers } = await openRoadTest()
    const res = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'More lift-off regen for the long descent', justifications: reasons(dangers) })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ profileId, parentVersionId: versionId, state: 'in-review', origin: 'roadside', roadTestId, justifications: reasons(dangers) })
    const view = await engineer.call('GET', `/api/versions/${res.body.id}`)
    expect(view.body.justifications).toEqual(reasons(dangers))
    expect(view.body.evaluation.warnings.filter((w: { severity: string }) => w.severity === 'danger').map((w: { rule: string }) => w.rule)).toEqual(expect.arrayContaining(dangers))
    expect(view.body.roadTestId).toBe(roadTestId)
    const events = await withDatabase(c => c.query('SELECT action, data FROM audit_events WHERE "entityType" = \'version\' AND "entityId" = $1 ORDER BY id', [String(res.body.id)]))
    expect(events.rows.map(r => r.action)).toEqual(['version.created', 'version.submitted'])
    expect(events.rows[0].data).toMatchObject({ origin: 'roadside', roadTestId, parentVersionId: versionId, parameters: risky })
    expect(events.rows[1].data).toMatchObject({ origin: 'roadside', justifications: reasons(dangers), dangerCount: expect.any(Number) })
    const mail = await withDatabase(c => c.query('SELECT "to", text FROM mail_outbox WHERE subject LIKE $1', [`%${car.stockRef}%v${res.body.versionNo}`]))
    expect(mail.rows.map(r => r.to)).toContain('engineer@voltwright.test')
    expect(mail.rows[0].text).toContain('changed at the roadside')
    // It goes on through review like any other version.
    expect((await lead.call('POST', `/api/versions/${res.body.id}/approve`, { comment: 'ok' })).status).toBe(200)
  })

  it('holds the tested version\'s sign-off while the change made on that drive is undecided, and lets it go once the change is sent back', async () => {
    const { roadTestId, risky, dangers } = await openRoadTest()
    const change = await tester.call('POST', `/api/road-tests/${roadTestId}/roadside-version`, { parameters: risky, rationale: 'Tried more regen on the descent', justifications: reasons(dangers) })
    expect(change.status).toBe(201)
    const held = await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)
    expect(held.status).toBe(409)
    expect(held.body.data.missing.map((m: { code: string }) => m.code)).toEqual(['roadside-change-open'])
    expect(held.body.message).toContain(`v${change.body.versionNo}`)
    expect((await engineer.call('POST', `/api/versions/${change.body.id}/reject`, { comment: 'Too much for this car; put the tested values back' })).status).toBe(200)
    expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
  })
})
