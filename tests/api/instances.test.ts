// Two server instances on one database, object store and SMTP server, as behind a load balancer
// (docs/deployment.md): sessions, sign-outs, races and the mail sender hold across them.
import { describe, it, expect, afterAll } from 'vitest'
import { useRunningServer, signIn, callerAt, baseUrl, withDatabase, type Caller } from './helpers'
import { newCar, newProfile } from './version-fixtures'
import { startSecondInstance } from './second-instance'

const RACERS = 10
const SUBMITTED = 6
const SENDER_ROUND_MS = 2000 // server/plugins/mail-sender.ts
// maildev's REST API (PACKAGES.md): GET /api/email lists what the SMTP sink received.
const mailApi = process.env.VOLTWRIGHT_MAIL_API ?? 'http://127.0.0.1:1090'
interface SunkMail { subject: string, text: string, to: { address: string }[] }

const versionLink = (id: number) => `${baseUrl}/versions/${id}\n`
const outboxFor = (ids: number[]) => withDatabase(async c => (await c.query(
  `SELECT "to", subject, state FROM mail_outbox WHERE ${ids.map((_, i) => `text LIKE $${i + 1}`).join(' OR ')}`,
  ids.map(id => `%${versionLink(id)}%`))).rows as { to: string, subject: string, state: string }[])
const delivered = async (ids: number[]) => ((await (await fetch(`${mailApi}/api/email`)).json()) as SunkMail[])
  .filter(m => ids.some(id => m.text.includes(versionLink(id))))
  .map(m => `${m.to.map(t => t.address).join(',')} ${m.subject}`)

describe('two server instances on one database', async () => {
  await useRunningServer()
  const second = await startSecondInstance()
  afterAll(() => second.stop())
  const onSecond = (c: Caller) => callerAt(second.base, c.cookie)

  it('runs the same build: both answer, each on its own port', async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const here = await tuner.call('GET', '/api/auth/me')
    const there = await onSecond(tuner).call('GET', '/api/auth/me')
    expect(second.base).not.toBe(baseUrl)
    expect(there.status).toBe(200)
    expect(there.body).toEqual(here.body)
  })

  it('a session opened on either instance works on the other', async () => {
    const first = await signIn('tester@voltwright.test')
    expect((await onSecond(first).call('GET', '/api/auth/me')).body.email).toBe('tester@voltwright.test')
    const login = await callerAt(second.base, '').call('POST', '/api/auth/login', { email: 'auditor@voltwright.test', password: 'voltwright-demo' })
    expect(login.status).toBe(200)
    const cookie = (login.headers.getSetCookie?.() ?? []).map(c => c.split(';')[0]).join('; ')
    const me = await callerAt(baseUrl, cookie).call('GET', '/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.email).toBe('auditor@voltwright.test')
  })

  it('a sign-out on one instance is refused on the other, though the other had opened the cookie before', async () => {
    const here = await signIn('tester@voltwright.test')
    const there = onSecond(here)
    expect((await there.call('GET', '/api/auth/me')).status).toBe(200) // the second instance has now opened it
    expect((await here.call('POST', '/api/auth/logout')).status).toBe(200)
    expect((await there.call('GET', '/api/auth/me')).status).toBe(401)
    expect((await there.call('GET', '/api/_auth/session')).status).toBe(401)
    expect((await here.call('GET', '/api/auth/me')).status).toBe(401)
  })

  it(`${RACERS} approvals of one version raced across both instances give exactly one approval`, async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const engineer = await signIn('engineer@voltwright.test')
    const v = await newProfile(tuner, (await newCar(tuner)).id)
    expect((await onSecond(tuner).call('POST', `/api/versions/${v.id}/submit`, {})).status).toBe(200)
    const answers = await Promise.all(Array.from({ length: RACERS }, (_, i) =>
      (i % 2 ? onSecond(engineer) : engineer).call('POST', `/api/versions/${v.id}/approve`, { comment: `Fine, from racer ${i}` })))
    const statuses = answers.map(a => a.status)
    expect(statuses.filter(s => s === 200)).toHaveLength(1)
    expect(statuses.filter(s => s === 409)).toHaveLength(RACERS - 1)
    const reviews = await withDatabase(c => c.query('SELECT decision FROM reviews WHERE "versionId" = $1', [v.id]))
    expect(reviews.rows).toEqual([{ decision: 'approve' }])
    const events = await withDatabase(c => c.query(`SELECT count(*)::int AS n FROM audit_events WHERE "entityType" = 'version' AND "entityId" = $1 AND action = 'version.approved'`, [String(v.id)]))
    expect(events.rows[0].n).toBe(1)
    const approvedMail = (await outboxFor([v.id])).filter(m => m.subject.startsWith('Approved'))
    expect(approvedMail.map(m => m.to)).toEqual(['tuner@voltwright.test'])
  })

  it('each mail goes out once, though both instances run the mail sender', async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const car = await newCar(tuner)
    const versions = [] as number[]
    for (let i = 0; i < SUBMITTED; i++) versions.push((await newProfile(tuner, car.id)).id)
    // Submitted across both at once: every engineer of the workshop is told of each, so the outbox fills
    // with more than one sender's batch and both instances' senders find mail due.
    const submits = await Promise.all(versions.map((id, i) => (i % 2 ? onSecond(tuner) : tuner).call('POST', `/api/versions/${id}/submit`, {})))
    expect(submits.map(s => s.status)).toEqual(Array(SUBMITTED).fill(200))
    const queued = await outboxFor(versions)
    expect(queued.length).toBeGreaterThanOrEqual(SUBMITTED * 2) // at least engineer@ and lead@ for each
    await expect.poll(async () => (await outboxFor(versions)).filter(m => m.state !== 'sent').length, { timeout: 30_000, interval: 500 }).toBe(0)
    // A sender round that had read a message before another marked it sent would deliver it within its round:
    // let every round that could have started meanwhile finish before counting.
    await new Promise(r => setTimeout(r, 2 * SENDER_ROUND_MS + 500))
    const expected = queued.map(m => `${m.to} ${m.subject}`).sort()
    expect(new Set(expected).size).toBe(expected.length) // one outbox row per person and version
    expect((await delivered(versions)).sort()).toEqual(expected)
  })
})
