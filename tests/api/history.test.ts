import { describe, it, expect } from 'vitest'
import { parse } from 'csv-parse/sync'
import { useRunningServer, signIn, withDatabase, baseUrl } from './helpers'
import { newCar, testSpec, userId } from './fixtures'
import { newCar as newTuneCar, newProfile } from './version-fixtures'

describe('a car\'s history', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')

  const car = await newCar(tuner)
  await tuner.call('PATCH', `/api/vehicles/${car.id}`, { spec: { ...testSpec, kerbMassKg: 1075 } })
  await engineer.call('PATCH', `/api/vehicles/${car.id}`, { status: 'converting', registration: 'HX 61 AB' })
  const history = (path: string, as = auditor) => as.call('GET', `/api/vehicles/${car.id}/history${path}`)

  it('reads newest first with who did it and each change as before → after', async () => {
    const res = await history('')
    expect(res.status).toBe(200)
    expect(res.body.items.map((e: any) => e.action)).toEqual(['vehicle.updated', 'vehicle.updated', 'vehicle.created'])
    const [second, first, created] = res.body.items
    expect(second.actor.name).toBe('Maud Ellery')
    expect(first.actor.name).toBe('Dev Carrow')
    expect(first.changes).toContainEqual({ path: '/spec/kerbMassKg', op: 'replace', before: 1050, after: 1075, beforeKnown: true })
    expect(second.changes).toContainEqual({ path: '/status', op: 'replace', before: 'intake', after: 'converting', beforeKnown: true })
    expect(created.changes).toContainEqual({ path: '/make', op: 'add', before: undefined, after: 'Testwick', beforeKnown: true })
    expect(Number(second.id)).toBeGreaterThan(Number(first.id))
    expect(res.body.nextCursor).toBeNull()
  })

  it('filters by action, by family, by person and by date range', async () => {
    expect((await history('?action=vehicle.created')).body.items.map((e: any) => e.action)).toEqual(['vehicle.created'])
    expect((await history('?action=vehicle.')).body.items).toHaveLength(3)
    expect((await history('?action=snag.')).body.items).toHaveLength(0)
    const maud = await userId('engineer@voltwright.test')
    expect((await history(`?actorId=${maud}`)).body.items.map((e: any) => e.actor.id)).toEqual([maud])
    const today = new Date().toISOString().slice(0, 10)
    expect((await history(`?from=${today}&to=${today}`)).body.items).toHaveLength(3)
    expect((await history('?to=2020-01-01')).body.items).toHaveLength(0)
    expect((await history(`?from=${new Date(Date.now() + 60_000).toISOString()}`)).body.items).toHaveLength(0)
    const bad = await history('?action=DROP TABLE&limit=5000&from=yesterday')
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.map((f: any) => f.path).sort()).toEqual(['action', 'from', 'limit'])
  })

  it('pages by keyset and returns every event exactly once while new events arrive', async () => {
    const busy = await newCar(tuner)
    for (let i = 0; i < 20; i++) await tuner.call('PATCH', `/api/vehicles/${busy.id}`, { registration: `KP ${i}` })
    const existing = await withDatabase(async c => (await c.query('SELECT id FROM audit_events WHERE "vehicleId" = $1 ORDER BY id DESC', [busy.id])).rows.map(r => String(r.id)))
    expect(existing).toHaveLength(21)
    const seen: string[] = []
    let cursor: string | null = null
    let pages = 0
    do {
      const page: any = (await auditor.call('GET', `/api/vehicles/${busy.id}/history?limit=4${cursor ? `&cursor=${cursor}` : ''}`)).body
      seen.push(...page.items.map((e: any) => e.id))
      cursor = page.nextCursor
      pages++
      await tuner.call('PATCH', `/api/vehicles/${busy.id}`, { registration: `NEW ${pages}` })
    } while (cursor)
    expect(pages).toBe(6)
    expect(seen).toEqual(existing)
    const fresh = (await auditor.call('GET', `/api/vehicles/${busy.id}/history?limit=200`)).body.items
    expect(new Set(fresh.map((e: any) => e.id)).size).toBe(21 + pages)
  })

  it('exports the filtered history as CSV that a standard parser reads back', async () => {
    const res = await fetch(`${baseUrl}/api/vehicles/${car.id}/history.csv?action=vehicle.updated`, { headers: { cookie: auditor.cookie } })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toContain(`history-${car.stockRef}.csv`)
    const text = await res.text()
    expect(text.split('\r\n').length).toBeGreaterThan(2) // RFC 4180 line ends
    const rows = parse(text, { bom: true, columns: true }) as Record<string, string>[]
    expect(rows).toHaveLength(2)
    expect(rows.map(r => r.action)).toEqual(['vehicle.updated', 'vehicle.updated'])
    expect(rows[1]!['changes (before → after)']).toContain('Kerb mass (converted), kg: 1,050 → 1,075')
    expect(rows[0]!.by).toBe('Maud Ellery')
    expect(rows[0]!.hash).toMatch(/^[0-9a-f]{64}$/)
    // The written time is the same moment as the ISO one, in UTC as its heading says, whatever the server's zone.
    const t = new Date(rows[0]!['time (UTC)']!)
    expect(rows[0]!['when (UTC)']).toMatch(new RegExp(`^${t.getUTCDate()} \\w+ ${t.getUTCFullYear()}, ${String(t.getUTCHours()).padStart(2, '0')}:${String(t.getUTCMinutes()).padStart(2, '0')}$`))
  })

  it('is for staff and auditors: the owner, another workshop and the signed-out are kept out', async () => {
    expect((await history('', tester)).status).toBe(200)
    const ownCar = (await client.call('GET', '/api/vehicles')).body.items[0]
    expect((await client.call('GET', `/api/vehicles/${ownCar.id}/history`)).status).toBe(403)
    expect((await client.call('GET', `/api/vehicles/${car.id}/history`)).status).toBe(404)
    expect((await otherAdmin.call('GET', `/api/vehicles/${car.id}/history`)).status).toBe(404)
    const csv = await fetch(`${baseUrl}/api/vehicles/${car.id}/history.csv`, { headers: { cookie: client.cookie } })
    expect(csv.status).toBe(404)
    expect((await fetch(`${baseUrl}/api/vehicles/${car.id}/history`)).status).toBe(401)
  })

  it('offers a workshop-wide activity feed to auditors, managers and engineers, with the same filters', async () => {
    expect((await tester.call('GET', '/api/audit/events')).status).toBe(403)
    expect((await client.call('GET', '/api/audit/events')).status).toBe(403)
    const feed = await engineer.call('GET', `/api/audit/events?limit=5&vehicleId=${car.id}`)
    expect(feed.body.items.map((e: any) => e.vehicle.stockRef)).toEqual([car.stockRef, car.stockRef, car.stockRef])
    const all = await auditor.call('GET', '/api/audit/events?limit=50&action=vehicle.created')
    expect(all.body.items.every((e: any) => e.action === 'vehicle.created')).toBe(true)
    expect(all.body.items.some((e: any) => e.vehicle?.stockRef === 'SB-001')).toBe(false)
    const facets = await auditor.call('GET', '/api/audit/facets')
    expect(facets.body.actions).toContain('vehicle.created')
    expect(facets.body.actors.map((a: any) => a.name)).toContain('Dev Carrow')
    const carFacets = await auditor.call('GET', `/api/audit/facets?vehicleId=${car.id}`)
    expect(carFacets.body).toEqual({ actions: ['vehicle.created', 'vehicle.updated'], actors: [{ id: await userId('tuner@voltwright.test'), name: 'Dev Carrow' }, { id: await userId('engineer@voltwright.test'), name: 'Maud Ellery' }] })
    expect((await otherAdmin.call('GET', `/api/audit/facets?vehicleId=${car.id}`)).status).toBe(404)
  })

  it('knows what a draft\'s first edit replaced, from the version\'s creation, on a whole page and a filtered one', async () => {
    const tuneCar = await newTuneCar(tuner)
    const draft = await newProfile(tuner, tuneCar.id, { rationale: 'First cut' })
    const from = draft.parameters.powerCapKw
    const edit = await tuner.call('PATCH', `/api/versions/${draft.id}`, { lockVersion: draft.lockVersion, parameters: { ...draft.parameters, powerCapKw: from - 5 }, rationale: 'Gentler for the first drive' })
    expect(edit.status, JSON.stringify(edit.body)).toBe(200)
    for (const query of ['', '?action=version.edited']) {
      const res = await auditor.call('GET', `/api/vehicles/${tuneCar.id}/history${query}`)
      const edited = res.body.items.find((e: any) => e.action === 'version.edited')
      expect(edited.changes).toContainEqual({ path: '/parameters/powerCapKw', op: 'replace', before: from, after: from - 5, beforeKnown: true })
      expect(edited.changes).toContainEqual({ path: '/rationale', op: 'replace', before: 'First cut', after: 'Gentler for the first drive', beforeKnown: true })
    }
  })
})
