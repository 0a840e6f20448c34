import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, withDatabase, type Caller } from './helpers'
import { routeFiles, routeUrl, type Route } from './routes'
import { demoFixtures, routeAccess, type Access, type Fixture } from './route-access'
import { roles, type Role } from '../../shared/schemas/roles'

const changes = () => withDatabase(async c => Number((await c.query('SELECT (SELECT count(*) FROM audit_events) + (SELECT count(*) FROM mail_outbox) AS n')).rows[0].n))

describe('every route answers each role, nobody and another workshop as its table says', async () => {
  await useRunningServer()
  const fixtures = await demoFixtures()
  const callers = Object.fromEntries(await Promise.all(roles.map(async r => [r, await signIn(`${r}@voltwright.test`)] as const))) as Record<Role, Caller>
  const foreigner = await signIn('admin@second.voltwright.test')
  const routes = routeFiles()
  const entry = (r: Route): Access => routeAccess[r.file]!
  const urlFor = (r: Route, overrides: Partial<Record<Fixture, string>> = {}) => routeUrl(r, (param) => {
    const fixture = entry(r).params?.[param]
    if (!fixture) throw new Error(`${r.file}: the table gives no fixture for [${param}]`)
    return overrides[fixture] ?? fixtures[fixture]
  })
  // Allowed callers send a body no schema accepts (a JSON array), so a change is refused before it is made.
  const brokenBody = (r: Route) => r.method === 'GET' ? undefined : []
  const line = (r: Route, who: string, status: number) => `${r.method} ${r.file} as ${who} → ${status}`

  it('has a rule for every route file, and no rule for a file that is gone', () => {
    const files = routes.map(r => r.file)
    expect(files.length).toBeGreaterThan(50)
    expect(files.filter(f => !routeAccess[f]), 'route files without an entry in tests/api/route-access.ts').toEqual([])
    expect(Object.keys(routeAccess).filter(f => !files.includes(f)), 'entries for route files that no longer exist').toEqual([])
    for (const r of routes) {
      const params = r.segments.filter(s => /^\[.+\]$/.test(s)).map(s => s.slice(1, -1))
      expect(Object.keys(entry(r).params ?? {}).sort(), r.file).toEqual(params.sort())
    }
  })

  it('refuses each role the table does not allow (403), lets the others through, and changes nothing', async () => {
    const before = await changes()
    const wrong: string[] = []
    for (const r of routes.filter(r => r.file !== 'auth/logout.post.ts')) {
      const a = entry(r)
      await Promise.all(roles.map(async (role) => {
        const res = await callers[role].call(r.method, urlFor(r), brokenBody(r))
        const allowed = a.roles.includes(role)
        const ok = !allowed
          ? res.status === 403
          : res.status < 500 && ![401, 403, 404].includes(res.status) && (r.method === 'GET' || [400, 409, 415, 422].includes(res.status))
        if (!ok) wrong.push(`${line(r, role, res.status)} (${allowed ? 'allowed' : 'not allowed'}) ${JSON.stringify(res.body).slice(0, 160)}`)
      }))
    }
    expect(wrong).toEqual([])
    expect(await changes(), 'audit events or mail written by refused calls').toBe(before)
  })

  it('lets every role and nobody sign out of a session of their own', async () => {
    const route = routes.find(r => r.file === 'auth/logout.post.ts')!
    for (const role of roles) {
      const session = await signIn(`${role}@voltwright.test`)
      const res = await session.call('POST', urlFor(route))
      expect(res.status, role).toBe(200)
      // The browser is told to replace the session cookie with an empty one.
      const name = session.cookie.split('=')[0]!
      const cleared = (res.headers.getSetCookie?.() ?? []).find(c => c.startsWith(`${name}=`))
      expect(cleared, `${role}: the session cookie is not cleared`).toMatch(new RegExp(`^${name}=;`))
    }
    expect((await anonymous.call('POST', urlFor(route))).status).toBe(200)
  })

  it('answers 401 to nobody on every route that needs a person', async () => {
    const wrong: string[] = []
    await Promise.all(routes.map(async (r) => {
      const res = await anonymous.call(r.method, urlFor(r), brokenBody(r))
      const ok = entry(r).anonymous ? res.status < 500 && res.status !== 401 && res.status !== 403 : res.status === 401
      if (!ok) wrong.push(line(r, 'nobody', res.status))
    }))
    expect(wrong.sort()).toEqual([])
  })

  it('answers a manager of another workshop 404 on this workshop\'s ids, 403 where the role comes first', async () => {
    const before = await changes()
    const wrong: string[] = []
    await Promise.all(routes.filter(r => r.file !== 'auth/logout.post.ts').map(async (r) => {
      const a = entry(r)
      const res = await foreigner.call(r.method, urlFor(r), a.foreignBody ?? brokenBody(r))
      const ok = a.foreign === 'allowed' ? res.status < 500 && ![401, 403, 404].includes(res.status) : res.status === a.foreign
      if (!ok) wrong.push(`${line(r, 'admin@second', res.status)} (expected ${a.foreign}) ${JSON.stringify(res.body).slice(0, 160)}`)
    }))
    expect(wrong.sort()).toEqual([])
    expect(await changes()).toBe(before)
  })

  it('hides another owner\'s car from a client (404) on the routes that look the car up as its owner', async () => {
    const scoped = routes.filter(r => entry(r).ownerScoped)
    expect(scoped.length).toBeGreaterThan(4)
    const wrong: string[] = []
    for (const r of scoped) {
      const res = await callers.client.call(r.method, urlFor(r, { car: fixtures.otherCar }), brokenBody(r))
      if (res.status !== 404) wrong.push(line(r, 'client on another owner\'s car', res.status))
    }
    expect(wrong).toEqual([])
  })
})
