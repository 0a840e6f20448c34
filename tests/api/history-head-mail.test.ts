import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { addWorkshop, newCar } from './fixtures'

// maildev's REST API (PACKAGES.md): GET /api/email lists what the SMTP sink received.
const mailApi = process.env.VOLTWRIGHT_MAIL_API ?? 'http://127.0.0.1:1090'
interface SunkMail { subject: string, text: string, to: { address: string }[] }
const mailTo = async (address: string, subjectStart: string) =>
  ((await (await fetch(`${mailApi}/api/email`)).json()) as SunkMail[]).filter(m => m.subject.startsWith(subjectStart) && m.to.some(t => t.address === address))

describe('the history\'s head, mailed to the auditors', async () => {
  await useRunningServer()

  it('goes out on request to the auditors and whoever asked, with the line the verifier takes', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'], tuner: ['tuner'] })
    const bayAdmin = await signIn(bay.emails.admin!)
    await newCar(bayAdmin)
    expect((await (await signIn(bay.emails.tuner!)).call('POST', '/api/audit/head-mail')).status).toBe(403)
    expect((await bayAdmin.call('POST', '/api/audit/head-mail', { to: 'me' })).body.sentTo).toBe(1)
    expect((await bayAdmin.call('POST', '/api/audit/head-mail', { to: 'everyone' })).status).toBe(400)
    const res = await bayAdmin.call('POST', '/api/audit/head-mail')
    expect(res.status).toBe(200)
    expect(res.body.sentTo).toBe(2)
    const line = `${res.body.head.id}:${res.body.head.hash}`
    for (const [address, count] of [[bay.emails.auditor!, 1], [bay.emails.admin!, 2]] as const) {
      await expect.poll(async () => (await mailTo(address, 'History head of')).filter(m => m.subject.endsWith('on request')).length, { timeout: 15000, interval: 500 }).toBe(count)
    }
    const [mail] = (await mailTo(bay.emails.auditor!, 'History head of')).filter(m => m.subject.endsWith('on request'))
    expect(mail!.text).toContain(line)
    const pasted = mail!.text.split('\n').map(l => l.trim()).find(l => /^\d+:[0-9a-f]{64}$/.test(l))!
    expect((await (await signIn(bay.emails.auditor!)).call('GET', `/api/audit/verify?head=${pasted}`)).body).toMatchObject({ ok: true, notedHead: { ok: true } })
  })

  it('goes out on request at most three times in ten minutes per person, then answers 429 with when to try again', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'] })
    const bayAdmin = await signIn(bay.emails.admin!)
    for (let i = 0; i < 3; i++) expect((await bayAdmin.call('POST', '/api/audit/head-mail', { to: 'me' })).status).toBe(200)
    const refused = await bayAdmin.call('POST', '/api/audit/head-mail')
    expect(refused.status).toBe(429)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    // The auditor has an allowance of their own.
    expect((await (await signIn(bay.emails.auditor!)).call('POST', '/api/audit/head-mail', { to: 'me' })).status).toBe(200)
    const queued = await withDatabase(c => c.query(`SELECT count(*)::int AS n FROM mail_outbox WHERE "workshopId" = $1 AND subject LIKE '% on request'`, [bay.workshopId]))
    expect(queued.rows[0].n).toBe(4)
  })

  it('goes out once a day: the daily job asks every couple of seconds, on every instance, and the day\'s claim lets one mail through', async () => {
    const bay = await addWorkshop({ admin: ['admin'], auditor: ['auditor'] })
    const day = new Date().toISOString().slice(0, 10)
    await expect.poll(async () => (await mailTo(bay.emails.auditor!, 'History head of')).length, { timeout: 20000, interval: 500 }).toBe(1)
    const [mail] = await mailTo(bay.emails.auditor!, 'History head of')
    // The day is the UTC day the mail was claimed: the test may straddle midnight.
    const claims = await withDatabase(async c => (await c.query('SELECT day::text, "headId" FROM audit_head_mails WHERE "workshopId" = $1', [bay.workshopId])).rows)
    expect(claims).toHaveLength(1)
    expect(mail!.subject).toBe(`History head of ${await workshopName(bay.workshopId)}, ${claims[0].day}`)
    expect([day, new Date().toISOString().slice(0, 10)]).toContain(claims[0].day)
    expect(mail!.text).toContain('holds no events yet')
    // Two later rounds of the job, each seen claiming a workshop added after the mail went, find this day claimed.
    for (let round = 0; round < 2; round++) {
      const later = await addWorkshop({})
      await expect.poll(() => claimsOf(later.workshopId), { timeout: 20000, interval: 300 }).toBe(1)
    }
    await expect.poll(async () => withDatabase(async c => (await c.query(`SELECT count(*)::int AS n FROM mail_outbox WHERE "to" = $1 AND state = 'pending'`, [bay.emails.auditor])).rows[0].n), { timeout: 15000, interval: 300 }).toBe(0)
    expect(await mailTo(bay.emails.auditor!, 'History head of')).toHaveLength(1)
    expect(await withDatabase(async c => (await c.query('SELECT count(*)::int AS n FROM mail_outbox WHERE "to" = $1', [bay.emails.auditor])).rows[0].n)).toBe(1)
    expect(await claimsOf(bay.workshopId)).toBe(1)
  })

  it('claims the day in PostgreSQL: a second claim for the same workshop and day is refused by the database', async () => {
    const bay = await addWorkshop({ auditor: ['auditor'] })
    await expect.poll(() => claimsOf(bay.workshopId), { timeout: 20000, interval: 500 }).toBe(1)
    const again = await withDatabase(async c => c.query(`INSERT INTO audit_head_mails ("workshopId", day, "sentAt") SELECT "workshopId", day, now() FROM audit_head_mails WHERE "workshopId" = $1 ON CONFLICT DO NOTHING RETURNING 1`, [bay.workshopId]))
    expect(again.rowCount).toBe(0)
  })
})

const workshopName = (id: number) => withDatabase(async c => (await c.query('SELECT name FROM workshops WHERE id = $1', [id])).rows[0].name as string)
const claimsOf = (workshopId: number) => withDatabase(async c => (await c.query('SELECT count(*)::int AS n FROM audit_head_mails WHERE "workshopId" = $1', [workshopId])).rows[0].n as number)
