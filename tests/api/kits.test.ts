import { describe, it, expect } from 'vitest'
import jsonpatch from 'fast-json-patch'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { paths, submitAndApprove, testSpec } from './version-fixtures'
import { baselineSettings, bookIn, carProfile, newKit } from './kit-fixtures'

describe('conversion kits and their baseline', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const lead = await signIn('lead@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')

  it('lists the demo kits with their drive unit, newest approved baseline and the cars built from them', async () => {
    const res = await auditor.call('GET', '/api/kits')
    expect(res.status).toBe(200)
    const names = res.body.items.map((k: { name: string }) => k.name)
    expect(names).toEqual(expect.arrayContaining(['Forge RD-45 small rear-drive', 'Forge ES-110 estate']))
    const rd = res.body.items.find((k: { name: string }) => k.name === 'Forge RD-45 small rear-drive')
    expect(rd).toMatchObject({ platform: { key: 'fenlow-45' }, latestApproved: { versionNo: 2 } })
    expect(rd.carCount).toBeGreaterThanOrEqual(2)
    const page = (await auditor.call('GET', `/api/kits/${rd.id}`)).body
    // OF-107 was built on baseline v1; v2 was approved since, so it is not on the latest.
    expect(page.cars.find((c: { stockRef: string }) => c.stockRef === 'OF-107')).toMatchObject({ onLatest: false })
    expect(page.cars.find((c: { stockRef: string }) => c.stockRef === 'OF-108')).toMatchObject({ onLatest: true })
  })

  it('creates a kit whose baseline versions go through the same review: justifications, four eyes, history', async () => {
    const kit = await newKit(lead)
    expect(kit.versions).toHaveLength(1)
    const v1 = kit.versions[0]!
    expect(v1).toMatchObject({ versionNo: 1, state: 'draft' })
    const version = (await tuner.call('GET', `/api/versions/${v1.id}`)).body
    expect(version).toMatchObject({ vehicle: null, kit: { id: kit.id, name: kit.name }, parameters: expect.objectContaining(baselineSettings) })
    expect(version.history.map((h: { action: string }) => h.action)).toEqual(['version.created'])
    const submitted = await lead.call('POST', `/api/versions/${v1.id}/submit`, { justifications: {} })
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200)
    // The author (an engineer too) cannot approve their own baseline.
    expect((await lead.call('POST', `/api/versions/${v1.id}/approve`, { comment: '' })).status).toBe(403)
    expect((await engineer.call('POST', `/api/versions/${v1.id}/approve`, { comment: 'Good baseline' })).status).toBe(200)
    const after = (await tuner.call('GET', `/api/versions/${v1.id}`)).body
    expect(after.history.map((h: { action: string }) => h.action)).toEqual(['version.created', 'version.submitted', 'version.approved'])
    // A baseline is never road-tested itself: its cars are.
    const tester = await signIn('tester@voltwright.test')
    const awaiting = (await tester.call('GET', '/api/road-tests/awaiting')).body.items.map((i: { versionId: number }) => i.versionId)
    expect(awaiting).not.toContain(v1.id)
    const events = await withDatabase(async c => (await c.query(`SELECT action, "vehicleId" FROM audit_events WHERE "entityType" = 'kit' AND "entityId" = $1`, [String(kit.id)])).rows)
    expect(events).toEqual([{ action: 'kit.created', vehicleId: null }])
  })

  it('checks a new baseline version\'s settings against the kit\'s drive unit, as a car\'s are checked against the car\'s', async () => {
    const kit = await newKit(tuner)
    const path = `/api/profiles/${kit.baselineProfileId}/versions`
    const wrongKind = await tuner.call('POST', path, { parameters: { ...baselineSettings, powerCapKw: 'forty' } })
    expect(wrongKind.status).toBe(400)
    expect(wrongKind.body.data.fields).toEqual([{ path: 'parameters.powerCapKw', message: expect.stringContaining('can hold') }])
    const stranger = await tuner.call('POST', path, { parameters: { ...baselineSettings, boostKw: 20 } })
    expect(stranger.status).toBe(400)
    expect(stranger.body.data.unknown).toEqual(['boostKw'])
    expect((await tuner.call('POST', path, { parameters: { ...baselineSettings, powerCapKw: 42 } })).status).toBe(201)
  })

  it('refuses a kit whose fits run backwards or whose name is taken, and edits name, fits and template', async () => {
    const kit = await newKit(tuner)
    const backwards = await tuner.call('POST', '/api/kits', { name: 'Backwards', platformKey: 'fenlow-45', specTemplate: testSpec, fits: [{ make: 'A', model: 'B', yearFrom: 1970, yearTo: 1960 }] })
    expect(backwards.status).toBe(400)
    expect(paths(backwards.body)).toEqual(['fits.0.yearTo'])
    expect((await tuner.call('POST', '/api/kits', { name: kit.name, platformKey: 'fenlow-45', specTemplate: testSpec })).status).toBe(409)
    const edited = await engineer.call('PATCH', `/api/kits/${kit.id}`, { specTemplate: { ...testSpec, kerbMassKg: 1111 }, fits: [] })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ specTemplate: { kerbMassKg: 1111 }, fits: [] })
    expect((await auditor.call('PATCH', `/api/kits/${kit.id}`, { fits: [] })).status).toBe(403)
  })

  it('books a car in from a kit: the template with the car\'s own facts, and a first draft from the newest approved baseline', async () => {
    const kit = await newKit(tuner)
    expect((await bookIn(tuner, kit.id)).status).toBe(409)
    await submitAndApprove(tuner, engineer, kit.versions[0]!.id)
    const badSpec = await bookIn(tuner, kit.id, { spec: { kerbMassKg: -5 } })
    expect(badSpec.status).toBe(400)
    expect(paths(badSpec.body)).toEqual(['spec.kerbMassKg'])
    const res = await bookIn(tuner, kit.id, { spec: { kerbMassKg: 1080 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body).toMatchObject({ kitId: kit.id, platform: { key: 'fenlow-45' }, spec: { ...testSpec, kerbMassKg: 1080, payloadKg: 150 } })
    const profile = await carProfile(tuner, res.body.id)
    expect(profile.versions).toHaveLength(1)
    expect(profile.baseline).toEqual({ kitId: kit.id, kitName: kit.name, versionId: kit.versions[0]!.id, versionNo: 1, currentVersionId: profile.versions[0].id, differs: [], moved: null })
  })

  it('shows a car\'s deviations from the baseline, and the diff route works between the two', async () => {
    const kit = await newKit(tuner)
    await submitAndApprove(tuner, engineer, kit.versions[0]!.id)
    const car = (await bookIn(tuner, kit.id)).body
    const draft = (await carProfile(tuner, car.id)).versions[0]
    const loaded = (await tuner.call('GET', `/api/versions/${draft.id}`)).body
    const saved = await tuner.call('PATCH', `/api/versions/${draft.id}`, { lockVersion: loaded.lockVersion, parameters: { ...loaded.parameters, powerCapKw: 35 } })
    expect(saved.status).toBe(200)
    expect((await carProfile(tuner, car.id)).baseline.differs).toEqual(['powerCapKw'])
    const diff = await engineer.call('GET', `/api/versions/${kit.versions[0]!.id}/diff/${draft.id}`)
    expect(diff.status).toBe(200)
    expect(diff.body.a).toMatchObject({ kitId: kit.id, vehicleId: null })
    expect(diff.body.patch).toEqual([{ op: 'replace', path: '/powerCapKw', value: 35 }])
    const baselineParams = (await tuner.call('GET', `/api/versions/${kit.versions[0]!.id}`)).body.parameters
    // fast-json-patch, an independent RFC 6902 library, applies the patch to the baseline to give the car's settings.
    expect(jsonpatch.applyPatch(structuredClone(baselineParams), diff.body.patch, true, false).newDocument).toEqual(saved.body.parameters)
  })
})
