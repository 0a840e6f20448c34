import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { addOnCarProfile, addSnag, newCar, userId } from './fixtures'
import { routeFiles, routeUrl, type Route } from './routes'

// Routes that change no workshop data: they open or close the caller's own session, or compute and store nothing.
const SESSION_ONLY = new Set(['auth/login.post.ts', 'auth/logout.post.ts', 'evaluate.post.ts', 'fleet/search.post.ts', 'fleet/search.csv.post.ts'])
// The auditor's own: mails the history's head to the auditors (docs/history.md), changing no workshop data.
const AUDITORS_OWN = new Set(['audit/head-mail.post.ts'])

describe('an auditor reads everything and changes nothing', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner)
  const { profileId, versionId, roadTestId } = await addOnCarProfile(car.id, { roadTest: 'pass' })
  const snagId = await addSnag(car.id, 'remedial', 'Offside rear drum binding')
  // A real thing of the auditor's own workshop behind each kind of id, so the only reason to refuse is the role.
  const ids: Record<string, string> = {
    'vehicles': String(car.id), 'profiles': String(profileId), 'versions': String(versionId), 'road-tests': String(roadTestId),
    'snags': String(snagId), 'users': String(await userId('tuner@voltwright.test')), 'platforms': 'fenlow-45', 'checks': 'heater-demister',
    'kits': await withDatabase(async c => String((await c.query(`SELECT k.id FROM kits k JOIN users u ON u."workshopId" = k."workshopId" WHERE u.email = 'auditor@voltwright.test' ORDER BY k.id LIMIT 1`)).rows[0].id))
  }
  const urlFor = (r: Route) => routeUrl(r, (_param, before) => {
    const id = ids[before]
    if (!id) throw new Error(`${r.file}: no test id for a "${before}" parameter; add one to the auditor walk`)
    return id
  })

  const routes = routeFiles()
  const mutating = routes.filter(r => r.method !== 'GET' && !SESSION_ONLY.has(r.file) && !AUDITORS_OWN.has(r.file))

  it('finds the route files on disk', () => {
    expect(routes.length).toBeGreaterThan(15)
    expect(mutating.map(r => r.file)).toEqual(expect.arrayContaining(['vehicles/index.post.ts', 'vehicles/[id].patch.ts', 'vehicles/[id]/readback.post.ts', 'users/index.post.ts']))
  })

  it('answers 403 to the auditor on every route that changes data, and nothing changes', async () => {
    const count = () => withDatabase(async c => Number((await c.query('SELECT (SELECT count(*) FROM audit_events) + (SELECT count(*) FROM mail_outbox) AS n')).rows[0].n))
    const before = await count()
    const answers: string[] = []
    for (const r of mutating) {
      const res = await auditor.call(r.method, urlFor(r), {})
      answers.push(`${r.method} ${r.file} → ${res.status}`)
    }
    expect(answers).toEqual(mutating.map(r => `${r.method} ${r.file} → 403`))
    expect(await count()).toBe(before)
  })

  it('reads the car, its history, its read-backs and the activity feed', async () => {
    for (const path of [`/api/vehicles/${car.id}`, `/api/vehicles/${car.id}/history`, `/api/vehicles/${car.id}/readbacks`, '/api/audit/events', '/api/audit/verify', '/api/drift', '/api/vehicles']) {
      expect((await auditor.call('GET', path)).status, path).toBe(200)
    }
  })
})
