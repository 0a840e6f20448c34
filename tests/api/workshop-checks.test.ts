import { describe, expect, it } from 'vitest'
import { anonymous, signIn, unique, useRunningServer, withDatabase } from './helpers'
import { approvedVersion, newCar, newProfile, passingChecks, PLATFORM, roadTestBody } from './road-test-fixtures'

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
})
