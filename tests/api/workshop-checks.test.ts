import { describe, expect, it } from 'vitest'
import { anonymous, baseUrl, signIn, unique, useRunningServer, withDatabase } from './helpers'
import { pdfText } from './pdf'
import { approvedVersion, newCar, newProfile, passingChecks, PLATFORM, recordRoadTest, roadTestBody } from './road-test-fixtures'

// A label short enough to sit on one line of the handover sheet's table.
const short = () => Math.random().toString(36).slice(2, 6)

describe('the workshop\'s own road-test checks', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')

  it('an admin adds, changes and retires a check, each with its audit event; nobody deletes one', async () => {
    const label = `Wipers ${unique('w')}`
    const made = await admin.call('POST', '/api/workshop/checks', { label, record: 'pass-fail', required: false })
    expect(made.status).toBe(201)
    expect(made.body).toMatchObject({ label, record: 'pass-fail', required: false, platformKeys: null, retired: false, unit: null })
    expect(made.body.key).toMatch(/^wipers-w-/)
    const listed = await tuner.call('GET', '/api/workshop/checks')
    expect(listed.body.items.map((c: { key: string }) => c.key)).toContain(made.body.key)
    expect((await otherAdmin.call('GET', '/api/workshop/checks')).body.items.map((c: { key: string }) => c.key)).not.toContain(made.body.key)
    const changed = await admin.call('PATCH', `/api/workshop/checks/${made.body.key}`, { label: 'Wipers, both speeds', required: true })
    expect(changed.body).toMatchObject({ key: made.body.key, label: 'Wipers, both speeds', required: true })
    const retired = await admin.call('PATCH', `/api/workshop/checks/${made.body.key}`, { retired: true })
    expect(retired.body.retired).toBe(true)
    expect((await admin.call('DELETE', `/api/workshop/checks/${made.body.key}`)).status).toBeGreaterThanOrEqual(404)
    const events = await withDatabase(c => c.query(`SELECT action FROM audit_events WHERE "entityType" = 'workshop-check' AND data->'after'->>'key' = $1 ORDER BY id`, [made.body.key]))
    expect(events.rows.map(r => r.action)).toEqual(['workshop-check.created', 'workshop-check.changed', 'workshop-check.changed'])
    expect((await otherAdmin.call('PATCH', `/api/workshop/checks/${made.body.key}`, { label: 'Theirs' })).status).toBe(404)
  })

  it('checks the body: a number check with its unit and a range in order; only an admin; the six drive checks are not its to change', async () => {
    const bad = await admin.call('POST', '/api/workshop/checks', { label: 'Pack voltage', record: 'number', unit: 'V', min: 400, max: 300, required: false })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.map((f: { path: string }) => f.path)).toContain('max')
    expect((await admin.call('POST', '/api/workshop/checks', { label: 'Horn', record: 'pass-fail', unit: 'dB' })).status).toBe(400)
    expect((await tuner.call('POST', '/api/workshop/checks', { label: 'Horn', record: 'pass-fail' })).status).toBe(403)
    expect((await anonymous.call('GET', '/api/workshop/checks')).status).toBe(401)
    expect((await admin.call('PATCH', '/api/workshop/checks/hill-start', { retired: true })).status).toBe(404)
    const hill = await admin.call('POST', '/api/workshop/checks', { label: 'Hill start', record: 'pass-fail' })
    expect(hill.body.key).toMatch(/^hill-start-\d+$/)
    await admin.call('PATCH', `/api/workshop/checks/${hill.body.key}`, { retired: true })
  })

  it('a road test needs every required check for its drive unit (a 400 naming it) and keeps the list it was recorded with', async () => {
    const heater = await admin.call('POST', '/api/workshop/checks', { label: `Heater ${unique('h')}`, record: 'pass-fail', required: true, platformKeys: [PLATFORM] })
    const volts = await admin.call('POST', '/api/workshop/checks', { label: `12 V supply ${unique('v')}`, record: 'number', unit: 'V', min: 13.2, max: 14.8, required: false, platformKeys: [PLATFORM] })
    const elsewhere = await admin.call('POST', '/api/workshop/checks', { label: `Tow hitch ${unique('t')}`, record: 'pass-fail', required: true, platformKeys: ['ulvane-220'] })
    try {
      const car = await newCar(tuner)
      const versionId = await approvedVersion(await newProfile(car.id))
      const brief = await tester.call('GET', `/api/versions/${versionId}/road-test-brief`)
      const briefKeys = brief.body.extraChecks.map((c: { key: string }) => c.key)
      expect(briefKeys).toEqual(expect.arrayContaining([heater.body.key, volts.body.key]))
      expect(briefKeys).not.toContain(elsewhere.body.key)

      const missing = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody())
      expect(missing.status).toBe(400)
      expect(missing.body.message).toContain(`The "${heater.body.label}" check is required`)
      const noValue = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({ checks: [...passingChecks(), { key: heater.body.key, verdict: 'pass', values: {}, note: '' }, { key: volts.body.key, verdict: 'pass', values: {}, note: '' }] }))
      expect(noValue.status).toBe(400)
      expect(noValue.body.data.fields).toEqual([{ path: 'checks.7.values.value', message: `${volts.body.label}: the measured value is needed` }])
      const unknown = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({ checks: [...passingChecks(), { key: heater.body.key, verdict: 'pass', values: {}, note: '' }, { key: elsewhere.body.key, verdict: 'pass', values: {}, note: '' }] }))
      expect(unknown.status).toBe(400)
      const withoutSix = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({ checks: [{ key: heater.body.key, verdict: 'pass', values: {}, note: '' }] }))
      expect(withoutSix.status).toBe(400)

      const ok = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody({
        checks: [...passingChecks(), { key: heater.body.key, verdict: 'pass', values: {}, note: 'Warm in 3 min' }, { key: volts.body.key, verdict: 'pass', values: { value: 13.9 }, note: '' }]
      }))
      expect(ok.status).toBe(201)
      expect(ok.body.checkList.map((c: { key: string }) => c.key)).toEqual(expect.arrayContaining([heater.body.key, volts.body.key]))
      expect(ok.body.checks.find((c: { key: string }) => c.key === volts.body.key).values).toEqual({ value: 13.9 })

      // Changing the list later never changes the old record.
      await admin.call('PATCH', `/api/workshop/checks/${heater.body.key}`, { label: 'Heater, renamed' })
      const again = await tester.call('GET', `/api/road-tests/${ok.body.id}`)
      expect(again.body.checkList.find((c: { key: string }) => c.key === heater.body.key).label).toBe(heater.body.label)
    } finally {
      for (const c of [heater, volts, elsewhere]) await admin.call('PATCH', `/api/workshop/checks/${c.body.key}`, { retired: true })
    }
  })

  it('a change keeps the rules: the range in order against the stored bound, known drive units, a retired check brought back before it changes', async () => {
    const made = await admin.call('POST', '/api/workshop/checks', { label: `Pack voltage ${unique('p')}`, record: 'number', unit: 'V', min: 300, max: 400 })
    const path = `/api/workshop/checks/${made.body.key}`
    const events = async () => (await withDatabase(c => c.query(`SELECT count(*)::int AS n FROM audit_events e JOIN workshop_checks w ON w.id::text = e."entityId"
      WHERE e."entityType" = 'workshop-check' AND w.key = $1`, [made.body.key]))).rows[0].n as number
    try {
      // Only one bound sent: the stored other one counts.
      const above = await admin.call('PATCH', path, { min: 450 })
      expect(above.status).toBe(400)
      expect(above.body.data.fields).toEqual([{ path: 'max', message: 'Must be above the lowest' }])
      expect((await admin.call('PATCH', path, { max: 250 })).status).toBe(400)
      expect((await admin.call('PATCH', path, { min: 400, max: 300 })).status).toBe(400)
      const cleared = await admin.call('PATCH', path, { min: null, max: 250 })
      expect(cleared.body).toMatchObject({ min: null, max: 250 })
      const unknown = await admin.call('PATCH', path, { platformKeys: ['no-such-unit'] })
      expect(unknown.status).toBe(400)
      expect(unknown.body.data.fields[0].path).toBe('platformKeys')
      expect((await admin.call('POST', '/api/workshop/checks', { label: 'Tow bar', record: 'pass-fail', platformKeys: ['no-such-unit'] })).status).toBe(400)
      expect((await admin.call('PATCH', path, { platformKeys: [PLATFORM, PLATFORM] })).body.platformKeys).toEqual([PLATFORM])
      // A change that changes nothing leaves no event.
      const before = await events()
      expect((await admin.call('PATCH', path, { label: cleared.body.label, platformKeys: [PLATFORM] })).status).toBe(200)
      expect(await events()).toBe(before)

      await admin.call('PATCH', path, { retired: true })
      const whileRetired = await admin.call('PATCH', path, { label: 'Pack voltage at rest', required: true })
      expect(whileRetired.status).toBe(400)
      expect(whileRetired.body.message).toMatch(/retired: bring it back/)
      expect((await tester.call('GET', '/api/workshop/checks')).body.items.find((c: { key: string }) => c.key === made.body.key)).toMatchObject({ retired: true, required: false })
      const back = await admin.call('PATCH', path, { retired: false, label: 'Pack voltage at rest' })
      expect(back.body).toMatchObject({ retired: false, label: 'Pack voltage at rest' })
      expect(await events()).toBe(before + 2)
      expect((await tester.call('PATCH', path, { label: 'Mine now' })).status).toBe(403)
    } finally {
      await admin.call('PATCH', path, { retired: true })
    }
  })

  it('the handover sheet lists the workshop\'s checks the road test was recorded with, with their verdicts and values', async () => {
    const horn = await admin.call('POST', '/api/workshop/checks', { label: `Horn ${short()}`, record: 'pass-fail', platformKeys: [PLATFORM] })
    const volts = await admin.call('POST', '/api/workshop/checks', { label: `Supply ${short()}`, record: 'number', unit: 'V', min: 13.2, max: 14.8, platformKeys: [PLATFORM] })
    try {
      const car = await newCar(tuner)
      const roadTestId = await recordRoadTest(tester, await approvedVersion(await newProfile(car.id)), {
        checks: [...passingChecks(), { key: horn.body.key, verdict: 'not-tested', values: {}, note: 'Fuse out' }, { key: volts.body.key, verdict: 'pass', values: { value: 13.85 }, note: '' }]
      })
      expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)
      // Renamed after the road test: the sheet keeps the name it was recorded with.
      await admin.call('PATCH', `/api/workshop/checks/${horn.body.key}`, { label: 'Horn, renamed later' })
      const res = await fetch(`${baseUrl}/api/vehicles/${car.id}/handover.pdf`, { headers: { cookie: tuner.cookie } })
      expect(res.status).toBe(200)
      const text = pdfText(Buffer.from(await res.arrayBuffer()))
      expect(text).toMatch(new RegExp(`${horn.body.label}\\s+Not tested\\s+—\\s+Fuse out`))
      expect(text).toMatch(new RegExp(`${volts.body.label}\\s+Pass\\s+13\\.85 V`))
      expect(text).not.toContain('Horn, renamed later')
    } finally {
      for (const c of [horn, volts]) await admin.call('PATCH', `/api/workshop/checks/${c.body.key}`, { retired: true })
    }
  })
})
