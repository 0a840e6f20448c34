import { execFile } from 'node:child_process'
import { createHash } from 'node:crypto'
import { promisify } from 'node:util'
import { describe, it, expect } from 'vitest'
// An RFC 8785 implementation from the npm registry, not Voltwright's own canonical JSON (docs/history.md).
import canonicalize from 'canonicalize'
import { useRunningServer, signIn, withDatabase, baseUrl, DEMO_PASSWORD, type Caller } from './helpers'
import { addWorkshop, newCar } from './fixtures'

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex')
interface Entry { id: string, form: number, prevHash: string | null, hash: string, action: string, record: Record<string, any> }

// docs/history.md, "Checking it yourself", steps 2 and 3.
async function everyEvent(as: Caller): Promise<Entry[]> {
  const events: Entry[] = []
  let cursor: string | null = null
  do {
    const page: { items: Entry[], nextCursor: string | null } = (await as.call('GET', `/api/audit/events?include=record&limit=200${cursor ? `&cursor=${cursor}` : ''}`)).body
    events.push(...page.items)
    cursor = page.nextCursor
  } while (cursor)
  return events.reverse()
}
const hashOf = (e: Entry) => e.form === 1 ? sha256((e.prevHash ?? '') + canonicalize(e.record)) : sha256(canonicalize(e.record)!)

// The shipped script, run as an auditor would run it.
async function script(email: string, noted?: string) {
  const args = ['docs/verify-history.mjs', baseUrl, ...(noted ? [noted] : [])]
  try {
    const { stdout } = await promisify(execFile)(process.execPath, args, { env: { ...process.env, VOLTWRIGHT_EMAIL: email, VOLTWRIGHT_PASSWORD: DEMO_PASSWORD } })
    return { code: 0, out: stdout }
  } catch (e) {
    return { code: (e as { code: number }).code, out: (e as { stdout: string }).stdout }
  }
}

// As the database superuser, inside one transaction so no other session ever sees the trigger off.
async function deleteBehindTheTriggersBack(ids: string[]) {
  await withDatabase(async (c) => {
    await c.query('BEGIN')
    await c.query('ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only')
    await c.query('DELETE FROM audit_events WHERE id = ANY($1::bigint[])', [ids])
    await c.query('ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only')
    await c.query('COMMIT')
  }, true)
}

describe('the history, checked from outside with the documentation only', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')

  it('gives every event its exact hashed record, and an independent RFC 8785 implementation recomputes every hash and link', async () => {
    await newCar(await signIn('tuner@voltwright.test'))
    const events = await everyEvent(auditor)
    expect(events.length).toBeGreaterThan(20)
    let prev: string | null = null
    for (const e of events) {
      expect(e.prevHash, e.id).toBe(prev)
      if (e.form === 2) expect(e.record.prevHash).toBe(prev)
      expect(hashOf(e), `event ${e.id} (${e.action})`).toBe(e.hash)
      prev = e.hash
    }
    expect(events.every(e => e.form === 2)).toBe(true) // a fresh database holds only the current form
    // What the screens leave out is in the record exactly as stored: snapshots and empty patches included.
    const stored = await withDatabase(async c => (await c.query(`SELECT id, data, actor, form FROM audit_events WHERE "workshopId" = (SELECT "workshopId" FROM users WHERE email = $1) ORDER BY id`, ['auditor@voltwright.test'])).rows)
    expect(stored.map(r => String(r.id))).toEqual(events.map(e => e.id))
    stored.forEach((r, i) => {
      expect(events[i]!.record.data).toEqual(r.data)
      expect(events[i]!.record.actor === null ? null : { name: events[i]!.record.actor.name, email: events[i]!.record.actor.email }).toEqual(r.actor)
    })
    expect(stored.some(r => r.data.before !== undefined || (Array.isArray(r.data.patch) && r.data.patch.length === 0))).toBe(true)
  })

  it('gives a car\'s history the same records, each recomputable on its own', async () => {
    const car = await withDatabase(async c => (await c.query(`SELECT v.id FROM vehicles v JOIN audit_events e ON e."vehicleId" = v.id JOIN users u ON u."workshopId" = v."workshopId"
      WHERE u.email = 'auditor@voltwright.test' ORDER BY v.id LIMIT 1`)).rows[0])
    const page = (await auditor.call('GET', `/api/vehicles/${car.id}/history?include=record&limit=200`)).body
    expect(page.items.length).toBeGreaterThan(0)
    for (const e of page.items as Entry[]) expect(hashOf(e)).toBe(e.hash)
    expect((await auditor.call('GET', `/api/vehicles/${car.id}/history`)).body.items[0].record).toBeUndefined()
    expect((await auditor.call('GET', `/api/vehicles/${car.id}/history?include=everything`)).status).toBe(400)
    // The records carry colleagues' e-mails: the people who read the history in words do not get them.
    const tuner = await signIn('tuner@voltwright.test')
    const engineer = await signIn('engineer@voltwright.test')
    expect((await tuner.call('GET', `/api/vehicles/${car.id}/history?include=record`)).status).toBe(403)
    expect((await tuner.call('GET', `/api/vehicles/${car.id}/history`)).status).toBe(200)
    expect((await engineer.call('GET', '/api/audit/events?include=record')).status).toBe(403)
    expect((await (await signIn('admin@voltwright.test')).call('GET', '/api/audit/events?include=record&limit=1')).status).toBe(200)
  })

  it('the shipped script says OK for the demo workshop', async () => {
    const run = await script('auditor@voltwright.test')
    expect(run.out).toMatch(/^OK: \d+ events; newest \d+:[0-9a-f]{64}/)
    expect(run.code).toBe(0)
  })

  it('form 1 is what the documentation says: events written by its description verify, and the chain goes on in form 2', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'] })
    const actorId = await withDatabase(async c => (await c.query('SELECT id FROM users WHERE email = $1', [bay.emails.admin])).rows[0].id)
    // Awkward values on purpose: numbers RFC 8785 writes in exponent form, keys that sort by UTF-16 units, escapes.
    const datas = [
      { after: { make: 'Forgewell', year: 1967, 'Zeta': 1, 'alpha': 2, 'é': 3, '😀': 4 } },
      { patch: [{ op: 'replace', path: '/registration', value: 'LH "1"\n' }], before: { registration: null }, big: 1e21, small: 1e-7, fraction: 0.1 + 0.2, negative: -5 },
      { patch: [] }
    ]
    let prevHash: string | null = null
    for (const [i, data] of datas.entries()) {
      const record = { action: 'vehicle.updated', actorId, createdAt: new Date(Date.UTC(2026, 10, 20, 9, 30, i, 5)).toISOString(), data, entityId: String(900 + i), entityType: 'vehicle', vehicleId: null, workshopId: bay.workshopId }
      const hash = sha256((prevHash ?? '') + canonicalize(record))
      await withDatabase(c => c.query(`INSERT INTO audit_events (form, "workshopId", "vehicleId", "actorId", action, "entityType", "entityId", data, "createdAt", "prevHash", hash)
        VALUES (1, $1, NULL, $2, $3, 'vehicle', $4, $5, $6, $7, $8)`, [bay.workshopId, actorId, record.action, record.entityId, JSON.stringify(data), record.createdAt, prevHash, hash]), true)
      prevHash = hash
    }
    const bayAdmin = await signIn(bay.emails.admin!)
    await newCar(bayAdmin)
    const bayAuditor = await signIn(bay.emails.auditor!)
    expect((await bayAuditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 4, firstBroken: null })
    const events = await everyEvent(bayAuditor)
    expect(events.map(e => e.form)).toEqual([1, 1, 1, 2])
    expect(events[3]!.prevHash).toBe(prevHash)
    expect(events[1]!.record).toEqual(expect.objectContaining({ actorId, data: datas[1] }))
    for (const e of events) expect(hashOf(e)).toBe(e.hash)
    expect((await script(bay.emails.auditor!)).code).toBe(0)
  })

  it('a chain cut short still verifies, but the head noted before is reported missing, by the verifier and by the script', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'] })
    const bayAdmin = await signIn(bay.emails.admin!)
    const bayAuditor = await signIn(bay.emails.auditor!)
    for (let i = 0; i < 5; i++) await newCar(bayAdmin)
    const before = (await bayAuditor.call('GET', '/api/audit/verify')).body
    expect(before).toMatchObject({ ok: true, checked: 5 })
    const noted = `${before.head.id}:${before.head.hash}`
    expect((await bayAuditor.call('GET', `/api/audit/verify?head=${noted}`)).body).toMatchObject({ ok: true, notedHead: { ok: true, problem: null } })

    const rows = await withDatabase(async c => (await c.query('SELECT id, hash FROM audit_events WHERE "workshopId" = $1 ORDER BY id', [bay.workshopId])).rows)
    await deleteBehindTheTriggersBack([String(rows[3].id), String(rows[4].id)])
    const plain = (await bayAuditor.call('GET', '/api/audit/verify')).body
    expect(plain).toMatchObject({ ok: true, checked: 3, head: { id: String(rows[2].id) } }) // a shorter chain holds on its own
    const checked = (await bayAuditor.call('GET', `/api/audit/verify?head=${noted}`)).body
    expect(checked).toMatchObject({ ok: false, checked: 3, firstBroken: null, notedHead: { id: before.head.id, ok: false, problem: 'missing' } })
    expect(checked.notedHead.message).toContain(`ends at event ${rows[2].id}`)
    const run = await script(bay.emails.auditor!, noted)
    expect(run.code).toBe(1)
    expect(run.out).toMatch(/^NOT OK: the noted head/)
    expect((await script(bay.emails.auditor!, `${rows[2].id}:${rows[2].hash}`)).code).toBe(0)

    // A head whose event is still there under another hash: the chain was rewritten up to it.
    const changed = (await bayAuditor.call('GET', `/api/audit/verify?head=${rows[2].id}:${'0'.repeat(64)}`)).body
    expect(changed).toMatchObject({ ok: false, notedHead: { problem: 'changed' } })
    expect((await bayAuditor.call('GET', '/api/audit/verify?head=12:not-a-hash')).status).toBe(400)
  })
})
