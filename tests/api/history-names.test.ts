import { execFileSync } from 'node:child_process'
import { describe, it, expect } from 'vitest'
import { parse } from 'csv-parse/sync'
import { useRunningServer, signIn, baseUrl, withDatabase } from './helpers'
import { addPerson } from './fixtures'
import { approvedVersion, newCar, newProfile, recordRoadTest } from './road-test-fixtures'

// poppler's pdftotext (Debian poppler-utils, installed by the test command) reads the text back.
const pdfText = (pdf: Buffer) => execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf, encoding: 'utf8' })

describe('who acted, as they were named at the time', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const adminNow = await withDatabase(async c => (await c.query('SELECT name, email FROM users WHERE email = $1', ['admin@voltwright.test'])).rows[0] as { name: string, email: string })
  const reviewer = await addPerson(['engineer'], 'Orla Quint')
  const car = await newCar(tuner)
  const versionId = await approvedVersion(await newProfile(car.id), { reviewer: reviewer.email })
  const roadTestId = await recordRoadTest(tester, versionId)
  expect((await tester.call('POST', `/api/road-tests/${roadTestId}/sign-off`)).status).toBe(200)

  it('keeps the old name on an approval after the approver is renamed: history, CSV, handover sheet; the chain still holds', async () => {
    expect((await admin.call('PATCH', `/api/users/${reviewer.id}`, { name: 'Orla Brannock' })).status).toBe(200)

    const history = (await auditor.call('GET', `/api/vehicles/${car.id}/history?action=version.approved`)).body.items
    expect(history).toHaveLength(1)
    expect(history[0].actor).toEqual({ id: reviewer.id, name: 'Orla Quint', recorded: true })

    const csv = await (await fetch(`${baseUrl}/api/vehicles/${car.id}/history.csv`, { headers: { cookie: auditor.cookie } })).text()
    const rows = parse(csv.replace(/^\uFEFF/, ''), { columns: true }) as Record<string, string>[]
    const approval = rows.find(r => r.action === 'version.approved')!
    expect(approval.by).toBe('Orla Quint')
    expect(csv).not.toContain('Orla Brannock')

    const pdf = Buffer.from(await (await fetch(`${baseUrl}/api/vehicles/${car.id}/handover.pdf`, { headers: { cookie: tuner.cookie } })).arrayBuffer())
    const text = pdfText(pdf)
    expect(text).toMatch(/Approved by\s+Orla Quint/)
    expect(text).not.toContain('Brannock')
    expect((await tuner.call('GET', `/api/vehicles/${car.id}/handover`)).body.profiles[0].people[1].name).toBe('Orla Quint')
    // The version's own page too.
    const version = (await tuner.call('GET', `/api/versions/${versionId}`)).body
    expect(version.reviews.map((r: { reviewer: { name: string } }) => r.reviewer.name)).toEqual(['Orla Quint'])
    const listed = (await tuner.call('GET', `/api/vehicles/${car.id}/profiles`)).body.items[0].versions[0]
    expect(listed.lastReview.reviewer.name).toBe('Orla Quint')

    // The rename itself is in the workshop's history, by the manager, with the old name as before.
    const events = (await auditor.call('GET', '/api/audit/events?action=user.renamed')).body.items
    const event = events.find((e: { entityId: string }) => e.entityId === String(reviewer.id))
    expect(event).toMatchObject({ vehicle: null, entityType: 'user', actor: { name: adminNow.name, recorded: true } })
    expect(event.changes).toEqual([{ path: '/name', op: 'replace', before: 'Orla Quint', after: 'Orla Brannock', beforeKnown: true }])

    expect((await auditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, firstBroken: null })
    // Stand the extra engineer down, so the later tests' mail to every engineer reaches only the demo ones.
    expect((await admin.call('PATCH', `/api/users/${reviewer.id}`, { active: false })).status).toBe(200)
  })

  it('records each change to a person as its own event of the workshop, the password never', async () => {
    const person = await addPerson(['tuner'], 'Ivo Tamsin')
    const patches = [{ roles: ['tuner', 'tester'] }, { active: false }, { active: true }, { password: 'a-new-password-for-ivo' }, { name: 'Ivo Tamsin' }]
    for (const body of patches) expect((await admin.call('PATCH', `/api/users/${person.id}`, body)).status).toBe(200)
    const events = (await auditor.call('GET', '/api/audit/events?action=user.&include=record&limit=200')).body.items
      .filter((e: { entityId: string }) => e.entityId === String(person.id)).reverse()
    expect(events.map((e: { action: string }) => e.action)).toEqual(['user.roles-changed', 'user.deactivated', 'user.reactivated', 'user.password-changed'])
    for (const e of events) expect(e).toMatchObject({ vehicle: null, form: 2, record: { vehicleId: null, actor: adminNow } })
    expect(JSON.stringify(events)).not.toContain('a-new-password-for-ivo')
    const stored = await withDatabase(async c => (await c.query(`SELECT count(*)::int AS n FROM audit_events WHERE "entityType" = 'user' AND "entityId" = $1`, [String(person.id)])).rows[0].n)
    expect(stored).toBe(4) // the unchanged name wrote nothing
  })
})
