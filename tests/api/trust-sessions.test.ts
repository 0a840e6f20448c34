// Sessions end when they should: a password change or a deactivation ends every session of that person, and
// reactivating revives none; every sign-in gets a new session id; the page's own session read shows the
// person as they are now (docs/security.md).
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, unique, type Caller } from './helpers'

const PASSWORD = 'first-password-123'

describe('sessions after changes to the person, and the policy on answers', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const newPerson = async (roles = ['tuner']) => {
    const email = `${unique('keeper')}@voltwright.test`
    const made = await admin.call('POST', '/api/users', { email, name: 'Lowen Tresize', roles, password: PASSWORD })
    expect(made.status).toBe(201)
    return { id: made.body.id as number, email }
  }
  const works = async (c: Caller) => (await c.call('GET', '/api/auth/me')).status === 200 && (await c.call('GET', '/api/_auth/session')).status === 200

  it('a password change ends every session of that person, in the API and in the page\'s own session read', async () => {
    const p = await newPerson()
    const [phone, laptop] = [await signIn(p.email, PASSWORD), await signIn(p.email, PASSWORD)]
    expect(await works(phone)).toBe(true)
    expect((await admin.call('PATCH', `/api/users/${p.id}`, { password: 'second-password-456' })).status).toBe(200)
    expect((await phone.call('GET', '/api/auth/me')).status).toBe(401)
    expect((await laptop.call('GET', '/api/_auth/session')).status).toBe(401)
    expect(await works(await signIn(p.email, 'second-password-456'))).toBe(true)
  })

  it('a deactivation ends them, and reactivating does not bring the old cookie back', async () => {
    const p = await newPerson()
    const old = await signIn(p.email, PASSWORD)
    expect((await admin.call('PATCH', `/api/users/${p.id}`, { active: false })).status).toBe(200)
    expect((await admin.call('PATCH', `/api/users/${p.id}`, { active: true })).status).toBe(200)
    expect((await old.call('GET', '/api/auth/me')).status).toBe(401)
    expect((await old.call('GET', '/api/_auth/session')).status).toBe(401)
    expect(await works(await signIn(p.email, PASSWORD))).toBe(true)
  })

  it('a change of name or roles alone ends nothing, and the page\'s session read shows the current roles', async () => {
    const p = await newPerson(['tuner'])
    const s = await signIn(p.email, PASSWORD)
    expect((await s.call('GET', '/api/_auth/session')).body.user.roles).toEqual(['tuner'])
    expect((await admin.call('PATCH', `/api/users/${p.id}`, { roles: ['tuner', 'tester'], name: 'Lowen Tresize-Hoskin' })).status).toBe(200)
    const read = await s.call('GET', '/api/_auth/session')
    expect(read.status).toBe(200)
    expect(read.body.user.roles).toEqual(['tuner', 'tester'])
    expect(read.body.user.name).toBe('Lowen Tresize-Hoskin')
    expect(read.body.secure).toBeUndefined() // the session epoch stays on the server's side
  })

  // The busy reads check the person in the same round trip as their own query, scoped as the cookie says;
  // a role changed since sign-in must still decide what they see at once (server/utils/guards/signed-in.ts).
  it('a tuner made a car owner after signing in reads as an owner at once: car list, history, diff and evaluate', async () => {
    const p = await newPerson(['tuner'])
    const s = await signIn(p.email, PASSWORD)
    const before = await s.call('GET', '/api/vehicles?pageSize=5')
    expect(before.status).toBe(200)
    expect(before.body.total).toBeGreaterThan(0)
    const car = before.body.items[0]
    const versions = (await s.call('GET', `/api/vehicles/${car.id}/profiles`)).body.items.flatMap((pr: { versions: { id: number }[] }) => pr.versions)
    expect(versions.length).toBeGreaterThan(0)
    const diffUrl = `/api/versions/${versions[0].id}/diff/${versions.at(-1).id}`
    expect((await s.call('GET', diffUrl)).status).toBe(200)
    expect((await s.call('GET', `/api/vehicles/${car.id}/history?limit=5`)).status).toBe(200)
    const evaluate = { vehicleId: car.id, platformKey: car.platform.key, parameters: {} }
    expect((await s.call('POST', '/api/evaluate', evaluate)).status).not.toBe(404)

    expect((await admin.call('PATCH', `/api/users/${p.id}`, { roles: ['client'] })).status).toBe(200)
    const after = await s.call('GET', '/api/vehicles?pageSize=5')
    expect(after.status).toBe(200)
    expect(after.body).toEqual({ items: [], total: 0 }) // a new owner owns no car yet
    expect((await s.call('GET', `/api/vehicles/${car.id}/history?limit=5`)).status).toBe(404)
    expect((await s.call('GET', diffUrl)).status).toBe(403)
    expect((await s.call('POST', '/api/evaluate', evaluate)).status).toBe(404)
  })

  it('gives a new session id at every sign-in, even when the request brings a session cookie', async () => {
    const p = await newPerson()
    const first = await signIn(p.email, PASSWORD)
    const firstId = (await first.call('GET', '/api/_auth/session')).body.id
    expect(firstId).toMatch(/^[0-9a-f-]{36}$/)
    const again = await anonymous.call('POST', '/api/auth/login', { email: p.email, password: PASSWORD }, { cookie: first.cookie })
    expect(again.status).toBe(200)
    const cookie = (again.headers.getSetCookie?.() ?? []).map(c => c.split(';')[0]).join('; ')
    const secondId = (await anonymous.call('GET', '/api/_auth/session', undefined, { cookie })).body.id
    expect(secondId).toMatch(/^[0-9a-f-]{36}$/)
    expect(secondId).not.toBe(firstId)
  })

  const tuner = await signIn('tuner@voltwright.test')

  it('answers that are not pages: JSON, errors and scripts carry no policy with an unfilled nonce placeholder', async () => {
    for (const res of [await tuner.call('GET', '/api/auth/me'), await tuner.call('GET', '/api/_auth/session')]) {
      expect(res.status).toBe(200)
      expect(res.headers.get('content-security-policy')).toBe('default-src \'none\'; frame-ancestors \'none\'')
    }
    // An error answer carries the server's own error policy, which allows no script either.
    const refused = await anonymous.call('GET', '/api/auth/me')
    expect(refused.status).toBe(401)
    expect(refused.body.statusMessage).toBe('Unauthorized') // its own reason, not "Server Error"
    expect(refused.headers.get('content-security-policy') ?? '').not.toContain('{{nonce}}')
    expect(refused.headers.get('content-security-policy') ?? '').toMatch(/(script|default)-src 'none'/)
    // A page that sends a signed-out visitor to sign in is an answer without a page.
    for (const path of ['/cars', '/robots.txt', '/no-such-page']) {
      const moved = await anonymous.call('GET', path, undefined, { accept: 'text/html' })
      expect(moved.status).toBe(302)
      expect(moved.headers.get('content-security-policy')).toBe('default-src \'none\'; frame-ancestors \'none\'')
    }
  })

  it('pages keep their content security policy, with a real nonce', async () => {
    const page = await anonymous.call('GET', '/login', undefined, { accept: 'text/html' })
    const csp = page.headers.get('content-security-policy') ?? ''
    expect(csp).toMatch(/'nonce-[A-Za-z0-9+/=_-]{16,}'/)
    expect(csp).not.toContain('{{nonce}}')
    const script = /src="(\/_nuxt\/[^"]+\.js)"/.exec(String(page.body))?.[1]
    expect(script).toBeTruthy()
    const asset = await anonymous.call('GET', script!)
    expect(asset.headers.get('content-security-policy') ?? '').not.toContain('{{nonce}}')
  })
})
