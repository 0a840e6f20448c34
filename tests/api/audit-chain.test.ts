import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { addWorkshop, newCar } from './fixtures'

// The statement the application's own connection tries, and what PostgreSQL must answer.
async function refused(sql: string, params: unknown[] = []) {
  return withDatabase(async (c) => {
    try { await c.query(sql, params); return null } catch (e) { return e as { code: string, message: string } }
  })
}

// As the database superuser, inside one transaction so no other session ever sees the trigger off.
async function behindTheTriggersBack(sql: string, params: unknown[]) {
  await withDatabase(async (c) => {
    await c.query('BEGIN')
    await c.query('ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only')
    await c.query(sql, params)
    await c.query('ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only')
    await c.query('COMMIT')
  }, true)
}

describe('the audit chain', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const admin = await signIn('admin@voltwright.test')
  const someEvent = await withDatabase(async c => (await c.query('SELECT id FROM audit_events ORDER BY id LIMIT 1')).rows[0].id)

  it('refuses UPDATE, DELETE and TRUNCATE through the application\'s own connection', async () => {
    for (const sql of [`UPDATE audit_events SET action = 'forged' WHERE id = ${someEvent}`, `DELETE FROM audit_events WHERE id = ${someEvent}`, 'TRUNCATE audit_events']) {
      const e = await refused(sql)
      expect(e, sql).not.toBeNull()
      expect(e!.code, sql).toBe('42501') // insufficient_privilege
    }
    const row = await withDatabase(async c => (await c.query('SELECT action FROM audit_events WHERE id = $1', [someEvent])).rows[0])
    expect(row.action).not.toBe('forged')
  })

  it('gives the application no way round the trigger: it cannot disable or drop it, drop the table or become its owner', async () => {
    const attempts = [
      'ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only',
      'DROP TRIGGER audit_events_append_only ON audit_events',
      'DROP FUNCTION audit_events_refuse_change() CASCADE',
      'DROP TABLE audit_events CASCADE',
      'ALTER TABLE audit_events OWNER TO voltwright',
      'SET ROLE voltwright_history',
      'SET session_replication_role = replica',
      'CREATE RULE skip_updates AS ON UPDATE TO audit_events DO INSTEAD NOTHING',
      `SELECT setval('audit_events_id_seq', 1)`
    ]
    for (const sql of attempts) expect(await refused(sql), sql).not.toBeNull()
    const triggers = await withDatabase(async c => (await c.query(`SELECT tgname, tgenabled FROM pg_trigger WHERE tgrelid = 'audit_events'::regclass AND NOT tgisinternal ORDER BY tgname`)).rows)
    expect(triggers).toEqual([{ tgname: 'audit_events_append_only', tgenabled: 'O' }, { tgname: 'audit_events_no_truncate', tgenabled: 'O' }])
  })

  it('refuses an UPDATE even from the superuser while the trigger is on', async () => {
    const e = await withDatabase(async (c) => {
      try { await c.query(`UPDATE audit_events SET action = 'forged' WHERE id = ${someEvent}`); return null } catch (err) { return err as Error }
    }, true)
    expect(e?.message).toMatch(/append-only: UPDATE refused/)
  })

  it('lets only an auditor or a manager run the verifier, and finds the demo workshop\'s chain whole', async () => {
    expect((await tuner.call('GET', '/api/audit/verify')).status).toBe(403)
    const res = await auditor.call('GET', '/api/audit/verify')
    expect(res.status).toBe(200)
    expect(res.body.ok).toBe(true)
    expect(res.body.firstBroken).toBeNull()
    const count = await withDatabase(async c => Number((await c.query('SELECT count(*) FROM audit_events WHERE "workshopId" = (SELECT "workshopId" FROM users WHERE email = $1)', ['auditor@voltwright.test'])).rows[0].count))
    expect(res.body.checked).toBe(count)
    expect((await admin.call('GET', '/api/audit/verify')).body.ok).toBe(true)
  })

  it('leaves an unforked chain after 50 concurrent changes through the API', async () => {
    const cars = await Promise.all([0, 1, 2, 3, 4].map(() => newCar(tuner)))
    const workshopId = await withDatabase(async c => (await c.query('SELECT "workshopId" FROM vehicles WHERE id = $1', [cars[0]!.id])).rows[0].workshopId)
    const before = await withDatabase(async c => Number((await c.query('SELECT count(*) FROM audit_events WHERE "workshopId" = $1', [workshopId])).rows[0].count))
    const changes = Array.from({ length: 50 }, (_, i) => i % 2
      ? tuner.call('PATCH', `/api/vehicles/${cars[i % 5]!.id}`, { registration: `CC ${i}` })
      : newCar(tuner).then(() => ({ status: 201 })))
    const answers = await Promise.all(changes)
    expect(answers.every(a => a.status === 200 || a.status === 201)).toBe(true)
    const after = await withDatabase(async c => Number((await c.query('SELECT count(*) FROM audit_events WHERE "workshopId" = $1', [workshopId])).rows[0].count))
    expect(after - before).toBe(50)
    const forks = await withDatabase(async c => (await c.query('SELECT "prevHash", count(*) FROM audit_events WHERE "workshopId" = $1 GROUP BY "prevHash" HAVING count(*) > 1', [workshopId])).rows)
    expect(forks).toEqual([])
    const verify = await auditor.call('GET', '/api/audit/verify')
    expect(verify.body).toMatchObject({ ok: true, checked: after })
  })

  it('finds a row altered behind the trigger\'s back at that very event, and a removed row at the event after it', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'] })
    const bayAdmin = await signIn(bay.emails.admin!)
    const bayAuditor = await signIn(bay.emails.auditor!)
    for (let i = 0; i < 5; i++) await newCar(bayAdmin)
    const rows = await withDatabase(async c => (await c.query('SELECT * FROM audit_events WHERE "workshopId" = $1 ORDER BY id', [bay.workshopId])).rows)
    expect(rows).toHaveLength(5)
    expect((await bayAuditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 5 })

    const third = rows[2]
    await behindTheTriggersBack(`UPDATE audit_events SET data = jsonb_set(data, '{after,make}', '"Forgewell"') WHERE id = $1`, [third.id])
    const altered = (await bayAuditor.call('GET', '/api/audit/verify')).body
    expect(altered).toMatchObject({ ok: false, checked: 2, firstBroken: { id: String(third.id), problem: 'content' } })
    await behindTheTriggersBack('UPDATE audit_events SET data = $2 WHERE id = $1', [third.id, JSON.stringify(third.data)])
    expect((await bayAuditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 5 })

    // Who acted is hashed too (form 2): a rewritten name or a form set back to 1 is found at that event.
    for (const forgery of [`actor = jsonb_set(actor, '{name}', '"Someone Else"')`, 'form = 1']) {
      await behindTheTriggersBack(`UPDATE audit_events SET ${forgery} WHERE id = $1`, [third.id])
      expect((await bayAuditor.call('GET', '/api/audit/verify')).body, forgery).toMatchObject({ ok: false, checked: 2, firstBroken: { id: String(third.id), problem: 'content' } })
      await behindTheTriggersBack('UPDATE audit_events SET actor = $2, form = $3 WHERE id = $1', [third.id, JSON.stringify(third.actor), third.form])
    }
    expect((await bayAuditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 5 })

    const fourth = rows[3]
    await behindTheTriggersBack('DELETE FROM audit_events WHERE id = $1', [fourth.id])
    const removed = (await bayAuditor.call('GET', '/api/audit/verify')).body
    expect(removed).toMatchObject({ ok: false, checked: 3, firstBroken: { id: String(rows[4].id), problem: 'link' } })
    await withDatabase(c => c.query(`INSERT INTO audit_events (id, form, "workshopId", "vehicleId", "actorId", actor, action, "entityType", "entityId", data, "createdAt", "prevHash", hash)
      VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13)`, [fourth.id, fourth.form, fourth.workshopId, fourth.vehicleId, fourth.actorId, JSON.stringify(fourth.actor), fourth.action, fourth.entityType, fourth.entityId, JSON.stringify(fourth.data), fourth.createdAt, fourth.prevHash, fourth.hash]), true)
    expect((await bayAuditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 5 })

    expect((await auditor.call('GET', '/api/audit/verify')).body.ok).toBe(true)
  })
})
