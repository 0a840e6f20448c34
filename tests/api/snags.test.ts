import { describe, it, expect } from 'vitest'
import sharp from 'sharp'
import { useRunningServer, signIn, withDatabase, baseUrl } from './helpers'
import { multipart, newCar, upload } from './road-test-fixtures'

describe('snags', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const car = await newCar(tuner)
  const people = (await tester.call('GET', '/api/snags/assignees')).body.items
  const engineer = people.find((p: { name: string }) => p.name === 'Maud Ellery')

  it('raises a snag of each kind and lists them blocking first, then by priority', async () => {
    const made = []
    for (const s of [
      { kind: 'enhancement', title: 'Offer a heated screen', priority: 'low' },
      { kind: 'remedial', title: 'Rear wheel bearing rumbles', priority: 'high', detail: 'Near side, above 60 km/h' },
      { kind: 'conversion', title: 'Coolant pump relay chatters', priority: 'normal', blocking: true, assigneeId: engineer.id }
    ]) {
      const res = await tester.call('POST', `/api/vehicles/${car.id}/snags`, s)
      expect(res.status).toBe(201)
      made.push(res.body)
    }
    expect(made[2]).toMatchObject({ status: 'open', blocking: true, assignee: { id: engineer.id, name: 'Maud Ellery' }, createdBy: { name: 'Sol Brannagh' } })
    const list = await auditor.call('GET', `/api/vehicles/${car.id}/snags`)
    expect(list.body.items.map((s: { title: string }) => s.title)).toEqual(['Coolant pump relay chatters', 'Rear wheel bearing rumbles', 'Offer a heated screen'])
    const events = await withDatabase(c => c.query('SELECT count(*) FROM audit_events WHERE "vehicleId" = $1 AND action = \'snag.created\'', [car.id]))
    expect(Number(events.rows[0].count)).toBe(3)
  })

  it('filters by kind, status, priority and blocking, per car and across the workshop', async () => {
    const kind = await tuner.call('GET', `/api/vehicles/${car.id}/snags?kind=remedial`)
    expect(kind.body.items.map((s: { kind: string }) => s.kind)).toEqual(['remedial'])
    const blocking = await tuner.call('GET', `/api/vehicles/${car.id}/snags?blocking=true`)
    expect(blocking.body.total).toBe(1)
    const all = await tuner.call('GET', '/api/snags?status=unresolved&priority=high')
    expect(all.body.items.every((s: any) => s.priority === 'high' && ['open', 'in-hand'].includes(s.status))).toBe(true)
    expect(all.body.items.some((s: any) => s.vehicle.id === car.id)).toBe(true)
    const bad = await tuner.call('GET', '/api/snags?status=lost&kind=paint')
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['kind', 'status'])
  })

  it('changes a snag and records the change as a JSON Patch', async () => {
    const snag = (await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'Bonnet catch stiff' })).body
    const res = await tuner.call('PATCH', `/api/snags/${snag.id}`, { status: 'in-hand', assigneeId: engineer.id, priority: 'urgent' })
    expect(res.body).toMatchObject({ status: 'in-hand', priority: 'urgent', assignee: { id: engineer.id } })
    const ev = await withDatabase(c => c.query('SELECT data FROM audit_events WHERE "entityType" = \'snag\' AND "entityId" = $1 AND action = \'snag.updated\'', [String(snag.id)]))
    expect(ev.rows[0].data.patch).toContainEqual({ op: 'replace', path: '/status', value: 'in-hand' })
    const clientId = (await client.call('GET', '/api/auth/me')).body.id
    const wrong = await tuner.call('PATCH', `/api/snags/${snag.id}`, { assigneeId: clientId })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields[0].path).toBe('assigneeId')
    expect((await tuner.call('PATCH', `/api/snags/${snag.id}`, { status: 'parked' })).status).toBe(400)
  })

  it('keeps auditors and owners out of the list\'s changes, and other workshops out altogether', async () => {
    expect((await auditor.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'x' })).status).toBe(403)
    // Not their car: the car guard looks the car up first, so it is hidden (404) rather than refused.
    expect((await client.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'x' })).status).toBe(404)
    expect((await client.call('GET', '/api/snags')).status).toBe(403)
    const snag = (await tuner.call('GET', `/api/vehicles/${car.id}/snags`)).body.items[0]
    expect((await auditor.call('PATCH', `/api/snags/${snag.id}`, { status: 'done' })).status).toBe(403)
    expect((await otherAdmin.call('PATCH', `/api/snags/${snag.id}`, { status: 'done' })).status).toBe(404)
    expect((await otherAdmin.call('GET', `/api/vehicles/${car.id}/snags`)).status).toBe(404)
  })

  it('takes a photo, checks its type and size, makes a thumbnail and serves both to the workshop only', async () => {
    const snag = (await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'conversion', title: 'Chafed HV loom at the bulkhead' })).body
    const photo = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: { r: 164, g: 85, b: 31 } } }).jpeg().toBuffer()
    const res = await upload(tester, `/api/snags/${snag.id}/photos?caption=Bulkhead%20grommet`, multipart(photo, 'loom.jpg', 'image/jpeg'))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ caption: 'Bulkhead grommet', hasThumbnail: true, width: 1600, height: 1200, bytes: photo.length })
    const thumb = await fetch(`${baseUrl}/api/attachments/${res.body.id}?size=thumbnail`, { headers: { cookie: tuner.cookie } })
    expect(thumb.headers.get('content-type')).toBe('image/jpeg')
    const meta = await sharp(Buffer.from(await thumb.arrayBuffer())).metadata()
    expect([meta.width, meta.height]).toEqual([320, 240])
    const full = await fetch(`${baseUrl}/api/attachments/${res.body.id}`, { headers: { cookie: tuner.cookie } })
    expect(Buffer.from(await full.arrayBuffer()).equals(photo)).toBe(true)
    expect((await fetch(`${baseUrl}/api/attachments/${res.body.id}`, { headers: { cookie: otherAdmin.cookie } })).status).toBe(404)
    expect((await fetch(`${baseUrl}/api/attachments/${res.body.id}`, { headers: { cookie: client.cookie } })).status).toBe(403)
    expect((await tester.call('GET', `/api/snags/${snag.id}`)).body.photos).toHaveLength(1)
  })

  it('refuses a photo that is not an image, one that lies about its type, and one over 15 MB', async () => {
    const snag = (await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'Sill rust' })).body
    expect((await upload(tester, `/api/snags/${snag.id}/photos`, multipart('not a picture', 'notes.txt', 'text/plain'))).status).toBe(415)
    const png = await sharp({ create: { width: 10, height: 10, channels: 3, background: 'white' } }).png().toBuffer()
    expect((await upload(tester, `/api/snags/${snag.id}/photos`, multipart(png, 'sill.jpg', 'image/jpeg'))).status).toBe(415)
    expect((await upload(tester, `/api/snags/${snag.id}/photos`, multipart(Buffer.alloc(16 * 1024 * 1024, 1), 'huge.jpg', 'image/jpeg'))).status).toBe(413)
    const rows = await withDatabase(c => c.query('SELECT count(*) FROM attachments WHERE "ownerType" = \'snag\' AND "ownerId" = $1', [snag.id]))
    expect(Number(rows.rows[0].count)).toBe(0)
  })
})
