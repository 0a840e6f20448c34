import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, unique } from './helpers'

const people = {
  'admin@voltwright.test': ['admin'],
  'tuner@voltwright.test': ['tuner'],
  'engineer@voltwright.test': ['engineer'],
  'tester@voltwright.test': ['tester'],
  'auditor@voltwright.test': ['auditor'],
  'client@voltwright.test': ['client']
}

describe('sign-in', async () => {
  await useRunningServer()

  it.each(Object.entries(people))('%s signs in and the session knows the roles', async (email, roles) => {
    const me = await (await signIn(email)).call('GET', '/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.email).toBe(email)
    expect(me.body.roles).toEqual(roles)
    expect(me.body.workshop.name).toBe('Old Forge Electric Works')
  })

  it('sets an HttpOnly, SameSite session cookie', async () => {
    const res = await anonymous.call('POST', '/api/auth/login', { email: 'tuner@voltwright.test', password: 'voltwright-demo' })
    const cookie = res.headers.get('set-cookie') ?? ''
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
  })

  it('answers one plain message whether the e-mail or the password is wrong', async () => {
    const wrongPassword = await anonymous.call('POST', '/api/auth/login', { email: 'tuner@voltwright.test', password: 'not-the-password' })
    const wrongEmail = await anonymous.call('POST', '/api/auth/login', { email: 'nobody@voltwright.test', password: 'voltwright-demo' })
    expect(wrongPassword.status).toBe(401)
    expect(wrongEmail.status).toBe(401)
    expect(wrongPassword.body.message).toBe(wrongEmail.body.message)
    expect(JSON.stringify(wrongPassword.body)).not.toMatch(/stack|at .*\.mjs/)
  })

  it('slows down repeated failures against one account with 429 and a short Retry-After', async () => {
    const email = `${unique('guess')}@voltwright.test`
    const statuses: number[] = []
    let retryAfter = 0
    for (let i = 0; i < 7; i++) {
      const res = await anonymous.call('POST', '/api/auth/login', { email, password: 'wrong-password' }, { 'x-forwarded-for': '203.0.113.50' })
      statuses.push(res.status)
      retryAfter = Number(res.headers.get('retry-after'))
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429])
    expect(retryAfter).toBeGreaterThan(0)
    expect(retryAfter).toBeLessThanOrEqual(5) // the first wait (server/utils/people/sign-in-delays.ts)
  })

  it('names the fields at fault in a malformed sign-in', async () => {
    const res = await anonymous.call('POST', '/api/auth/login', { email: 42 })
    expect(res.status).toBe(400)
    expect(res.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['email', 'password'])
  })

  it('signs out', async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const res = await tuner.call('POST', '/api/auth/logout')
    expect(res.status).toBe(200)
    // The sealed cookie is replaced by an expired one, so the browser forgets the session.
    expect(res.headers.get('set-cookie') ?? '').toMatch(/nuxt-session=;|Max-Age=0|Expires=Thu, 01 Jan 1970/i)
  })
})
