import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { approvedVersion, newCar, newProfile, passingChecks, recordRoadTest, roadTestBody } from './road-test-fixtures'
import { preDriveCautions } from '../../shared/schemas/road-test-cautions'

await useRunningServer()

// The tester's tick under the pre-drive cautions is part of the record (docs/road-tests.md#before-you-set-off).
describe('a road test\'s pre-drive confirmation and what it found', async () => {
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const titles = preDriveCautions.map(c => c.title)

  it('refuses a record without the tick, by its field, and records nothing', async () => {
    const car = await newCar(tuner)
    const versionId = await approvedVersion(await newProfile(car.id))
    const { preDriveConfirmed: _, ...without } = roadTestBody()
    for (const body of [without, { ...without, preDriveConfirmed: false }]) {
      const res = await tester.call('POST', `/api/versions/${versionId}/road-tests`, body)
      expect(res.status).toBe(400)
      expect(res.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['preDriveConfirmed'])
    }
    const rows = await withDatabase(c => c.query('SELECT count(*)::int AS n FROM road_tests WHERE "versionId" = $1', [versionId]))
    expect(rows.rows[0].n).toBe(0)
  })

  it('keeps the tick with the cautions as read, shows it on the record and tells it in the history', async () => {
    const car = await newCar(tuner)
    const versionId = await approvedVersion(await newProfile(car.id))
    const id = await recordRoadTest(tester, versionId)
    const stored = await withDatabase(c => c.query('SELECT "preDrive" FROM road_tests WHERE id = $1', [id]))
    expect(stored.rows[0].preDrive).toEqual({ confirmed: true, cautions: titles })
    expect((await auditor.call('GET', `/api/road-tests/${id}`)).body.preDrive).toEqual({ confirmed: true, cautions: titles })
    const event = await withDatabase(c => c.query('SELECT data FROM audit_events WHERE action = $1 AND "entityId" = $2', ['road-test.recorded', String(id)]))
    expect(event.rows[0].data.preDrive).toEqual({ confirmed: true, cautions: titles })
    const csv = (await auditor.call('GET', `/api/vehicles/${car.id}/history.csv`)).body as string
    expect(csv).toContain(`Before setting off: Sol Brannagh read the pre-drive cautions (${titles.map(t => `“${t}”`).join(', ')}) and confirmed the car was ready to set off.`)
  })

  it('lists the snags a failed road test raised, and its sign-off refusal names the checks as testers know them', async () => {
    const car = await newCar(tuner)
    const versionId = await approvedVersion(await newProfile(car.id))
    const checks = passingChecks()
    checks[1] = { key: 'lift-off-regen', verdict: 'fail', values: { feel: 'harsh' }, note: 'Tail stepped out' } as never
    const id = await recordRoadTest(tester, versionId, { checks, verdict: 'fail' })
    const snag = await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'conversion', priority: 'high', blocking: true, roadTestId: id, title: 'Lift-off regen steps the tail out', detail: '' })
    expect(snag.status).toBe(201)
    await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', priority: 'normal', blocking: false, title: 'Not from a road test', detail: '' })
    expect((await auditor.call('GET', `/api/road-tests/${id}`)).body.snags).toEqual([{ id: snag.body.id, title: 'Lift-off regen steps the tail out', kind: 'conversion', status: 'open', blocking: true }])
    const refused = await tester.call('POST', `/api/road-tests/${id}/sign-off`)
    expect(refused.status).toBe(409)
    expect(refused.body.message).toContain('The lift-off regen check is failed.')
    expect(refused.body.message).not.toContain('lift-off-regen')
    const brief = (await tester.call('GET', `/api/versions/${versionId}/road-test-brief`)).body
    expect(brief.failedEarlier).toEqual({ id, testedAt: expect.any(String) })
    expect(brief.blockingSnags).toEqual([{ id: snag.body.id, title: 'Lift-off regen steps the tail out' }])
  })
})
