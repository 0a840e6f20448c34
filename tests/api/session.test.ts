// The sealed session cookie as the server opens it (and keeps it opened, per instance): only a cookie sealed
// with the server's password opens, a sign-in older than 12 hours is refused, and a deactivated person is
// refused at once even though their cookie was opened before; signing out refuses every copy of the cookie.
import { describe, it, expect } from 'vitest'
import { seal, defaults } from 'iron-webcrypto'
import { useRunningServer, signIn, anonymous, unique, withDatabase, type Caller } from './helpers'

const HOUR = 3600_000
const password = process.env.NUXT_SESSION_PASSWORD ?? ''

// A session sealed as h3 seals it ({ id, createdAt, data }, iron defaults), signed in `ageMs` ago.
async function sealedSession(user: Record<string, unknown>, ageMs: number, key = password) {
  const createdAt = Date.now() - ageMs
  return seal(globalThis.crypto, { id: crypto.randomUUID(), createdAt, data: { user, loggedInAt: createdAt } }, key, defaults)
}
const me = (cookie: string) => anonymous.call('GET', '/api/auth/me', undefined, { cookie: `nuxt-session=${cookie}` })

describe('the session cookie', async () => {
  await useRunningServer()
  const tuner = (await (await signIn('tuner@voltwright.test')).call('GET', '/api/auth/me')).body

  it('opens a cookie sealed with the server\'s password, again and again', async () => {
    expect(password.length).toBeGreaterThanOrEqual(32)
    const cookie = await sealedSession(tuner, 0)
    for (let i = 0; i < 3; i++) expect((await me(cookie)).body.email).toBe('tuner@voltwright.test')
  })

  it('refuses one sealed with another password, or changed by one character', async () => {
    expect((await me(await sealedSession(tuner, 0, 'x'.repeat(64)))).status).toBe(401)
    const good = await sealedSession(tuner, 0)
    const i = good.length - 5
    const changed = good.slice(0, i) + (good[i] === 'A' ? 'B' : 'A') + good.slice(i + 1)
    expect((await me(good)).status).toBe(200)
    expect((await me(changed)).status).toBe(401)
  })

  it('refuses a sign-in older than 12 hours, and says so in the cookie it sets', async () => {
    expect((await me(await sealedSession(tuner, 11 * HOUR))).status).toBe(200)
    expect((await me(await sealedSession(tuner, 13 * HOUR))).status).toBe(401)
    const login = await anonymous.call('POST', '/api/auth/login', { email: 'tuner@voltwright.test', password: 'voltwright-demo' })
    const expires = /Expires=([^;]+)/i.exec(login.headers.get('set-cookie') ?? '')?.[1]
    const hours = (Date.parse(expires ?? '') - Date.now()) / HOUR
    expect(hours).toBeGreaterThan(11.9)
    expect(hours).toBeLessThanOrEqual(12)
  })

  it('refuses a deactivated person at once, though their cookie was opened before', async () => {
    const admin = await signIn('admin@voltwright.test')
    const email = `${unique('leaver')}@voltwright.test`
    const made = await admin.call('POST', '/api/users', { email, name: 'Perrin Ashdown', roles: ['tuner'], password: 'leaver-password-123' })
    expect(made.status).toBe(201)
    const leaver: Caller = await signIn(email, 'leaver-password-123')
    expect((await leaver.call('GET', '/api/auth/me')).status).toBe(200)
    expect((await admin.call('PATCH', `/api/users/${made.body.id}`, { active: false })).status).toBe(200)
    expect((await leaver.call('GET', '/api/auth/me')).status).toBe(401)
  })

  it('refuses a copy of the cookie once its session has signed out, and only that session', async () => {
    const kept = await signIn('tester@voltwright.test')
    const other = await signIn('tester@voltwright.test')
    expect((await kept.call('GET', '/api/auth/me')).status).toBe(200)
    expect((await kept.call('POST', '/api/auth/logout')).status).toBe(200)
    expect((await kept.call('GET', '/api/auth/me')).status).toBe(401) // the copy kept from before signing out
    const pageSession = await kept.call('GET', '/api/_auth/session')
    expect(pageSession.status).toBe(401)
    expect((await other.call('GET', '/api/auth/me')).status).toBe(200) // another sign-in of the same person
    const row = await withDatabase(c => c.query('SELECT "expiresAt" FROM revoked_sessions WHERE "userId" = (SELECT id FROM users WHERE email = $1)', ['tester@voltwright.test']))
    expect(row.rows.length).toBeGreaterThanOrEqual(1)
  })
})
