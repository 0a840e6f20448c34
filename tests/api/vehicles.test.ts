import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, withDatabase, unique } from './helpers'

const spec = {
  kerbMassKg: 1050, frontAxleLoadPct: 50, wheelbaseMm: 2400, cgHeightMm: 500, tyreSize: '165/80 R15 86S',
  finalDriveRatio: 7.5, drivetrainEfficiency: 0.9, dragCoefficient: 0.42, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.01,
  drivenAxle: 'rear', originalEnginePowerKw: 55, packNominalVoltageV: 350, packCapacityKwh: 30,
  packMaxChargeCurrentA: 100, packMaxDischargeCurrentA: 300, chargerPowerKw: 7
}
const newCar = (platformKey: string) => ({ stockRef: unique('T').slice(0, 20), make: 'Testwick', model: 'Bench Saloon', year: 1966, platformKey, spec })

describe('vehicles', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const platforms = (await tuner.call('GET', '/api/platforms')).body.items
  const platformKey = platforms[0].key

  it('lists the workshop\'s cars with total, search, stage filter and sort', async () => {
    const all = await tuner.call('GET', '/api/vehicles?pageSize=100')
    expect(all.status).toBe(200)
    expect(all.body.total).toBeGreaterThanOrEqual(6)
    expect(all.body.items.every((v: { stockRef: string }) => !v.stockRef.startsWith('SB-'))).toBe(true)
    const found = await tuner.call('GET', '/api/vehicles?q=marten')
    expect(found.body.items.map((v: { model: string }) => v.model)).toEqual(['Marten Roadster'])
    const intake = await tuner.call('GET', '/api/vehicles?status=intake')
    expect(intake.body.items.every((v: { status: string }) => v.status === 'intake')).toBe(true)
    const byYear = await tuner.call('GET', '/api/vehicles?sort=year&dir=desc&pageSize=100')
    const years = byYear.body.items.map((v: { year: number }) => v.year)
    expect(years).toEqual([...years].sort((a, b) => b - a))
    const page2 = await tuner.call('GET', '/api/vehicles?pageSize=2&page=2')
    expect(page2.body.items).toHaveLength(2)
    expect(page2.body.items[0].id).not.toBe(all.body.items[0].id)
  })

  it('refuses a bad list query with the field named', async () => {
    const res = await tuner.call('GET', '/api/vehicles?status=parked&pageSize=1000')
    expect(res.status).toBe(400)
    expect(res.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['pageSize', 'status'])
  })

  it('creates a car, writes its audit event in the same change, and reads it back', async () => {
    const input = newCar(platformKey)
    const created = await tuner.call('POST', '/api/vehicles', input)
    expect(created.status).toBe(201)
    expect(created.body.spec.payloadKg).toBe(150)
    expect(created.body.spec.rotatingMassFactor).toBe(1.05)
    const read = await tuner.call('GET', `/api/vehicles/${created.body.id}`)
    expect(read.body.stockRef).toBe(input.stockRef)
    const events = await withDatabase(c => c.query('SELECT action, "actorId", data FROM audit_events WHERE "vehicleId" = $1 ORDER BY id', [created.body.id]))
    expect(events.rows.map(r => r.action)).toEqual(['vehicle.created'])
  })

  it('edits a car and records the change as a JSON Patch', async () => {
    const created = (await tuner.call('POST', '/api/vehicles', newCar(platformKey))).body
    const res = await tuner.call('PATCH', `/api/vehicles/${created.id}`, { status: 'converting', spec: { ...spec, kerbMassKg: 1075 } })
    expect(res.status).toBe(200)
    expect(res.body.status).toBe('converting')
    expect(res.body.spec.kerbMassKg).toBe(1075)
    const events = await withDatabase(c => c.query('SELECT data FROM audit_events WHERE "vehicleId" = $1 AND action = $2', [created.id, 'vehicle.updated']))
    const patch = events.rows[0].data.patch
    expect(patch).toContainEqual({ op: 'replace', path: '/status', value: 'converting' })
    expect(patch).toContainEqual({ op: 'replace', path: '/spec/kerbMassKg', value: 1075 })
  })

  it('changes only the fields an edit sends', async () => {
    const created = (await tuner.call('POST', '/api/vehicles', { ...newCar(platformKey), status: 'converting', chassisNumber: 'KEEP-1' })).body
    const res = await tuner.call('PATCH', `/api/vehicles/${created.id}`, { registration: 'ONLY 1' })
    expect(res.body.registration).toBe('ONLY 1')
    expect(res.body.status).toBe('converting')
    expect(res.body.chassisNumber).toBe('KEEP-1')
  })

  it('shows each wrong spec value against its field and changes nothing', async () => {
    const created = (await tuner.call('POST', '/api/vehicles', newCar(platformKey))).body
    const res = await tuner.call('PATCH', `/api/vehicles/${created.id}`, { spec: { ...spec, kerbMassKg: -5, tyreSize: 'big ones' } })
    expect(res.status).toBe(400)
    expect(res.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['spec.kerbMassKg', 'spec.tyreSize'])
    expect((await tuner.call('GET', `/api/vehicles/${created.id}`)).body.spec.kerbMassKg).toBe(1050)
  })

  it('refuses unknown fields, a duplicate stock ref and an unknown drive unit', async () => {
    const input = newCar(platformKey)
    expect((await tuner.call('POST', '/api/vehicles', { ...input, colour: 'red' })).status).toBe(400)
    expect((await tuner.call('POST', '/api/vehicles', input)).status).toBe(201)
    expect((await tuner.call('POST', '/api/vehicles', input)).status).toBe(409)
    const unknown = await tuner.call('POST', '/api/vehicles', { ...newCar('no-such-unit') })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fields[0].path).toBe('platformKey')
  })

  it('guards by role: a tester reads but does not edit; nobody signed out reads', async () => {
    const id = (await tuner.call('GET', '/api/vehicles')).body.items[0].id
    expect((await tester.call('GET', `/api/vehicles/${id}`)).status).toBe(200)
    expect((await tester.call('PATCH', `/api/vehicles/${id}`, { status: 'intake' })).status).toBe(403)
    expect((await tester.call('POST', '/api/vehicles', newCar(platformKey))).status).toBe(403)
    expect((await anonymous.call('GET', '/api/vehicles')).status).toBe(401)
    expect((await anonymous.call('GET', `/api/vehicles/${id}`)).status).toBe(401)
  })

  it('keeps workshops apart: workshop B\'s manager gets 404 on workshop A\'s car', async () => {
    const id = (await tuner.call('GET', '/api/vehicles')).body.items[0].id
    expect((await otherAdmin.call('GET', `/api/vehicles/${id}`)).status).toBe(404)
    expect((await otherAdmin.call('PATCH', `/api/vehicles/${id}`, { status: 'intake' })).status).toBe(404)
    const theirs = await otherAdmin.call('GET', '/api/vehicles')
    expect(theirs.body.items.map((v: { stockRef: string }) => v.stockRef)).toEqual(['SB-001'])
  })

  it('shows a car owner only their own cars, read-only', async () => {
    const mine = await client.call('GET', '/api/vehicles')
    expect(mine.body.total).toBe(2)
    const me = (await client.call('GET', '/api/auth/me')).body
    expect(mine.body.items.every((v: { ownerUserId: number }) => v.ownerUserId === me.id)).toBe(true)
    const notMine = (await tuner.call('GET', '/api/vehicles?pageSize=100')).body.items.find((v: { ownerUserId: number | null }) => v.ownerUserId !== me.id)
    expect((await client.call('GET', `/api/vehicles/${notMine.id}`)).status).toBe(404)
    expect((await client.call('PATCH', `/api/vehicles/${mine.body.items[0].id}`, { status: 'intake' })).status).toBe(403)
  })

  it('answers 400 for a malformed id and 404 for an unknown one', async () => {
    expect((await tuner.call('GET', '/api/vehicles/abc')).status).toBe(400)
    expect((await tuner.call('GET', '/api/vehicles/999999')).status).toBe(404)
    expect((await admin.call('GET', '/api/vehicles/999999')).body.stack).toBeUndefined()
  })
})
