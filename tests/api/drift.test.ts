import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { addOnCarProfile, newCar } from './fixtures'

const FORMAT = 'voltwright-readback/1'
const documentFor = (stockRef: string, parameters: Record<string, number>, extra: Record<string, unknown> = {}) =>
  ({ format: FORMAT, vehicle: stockRef, profile: 'Road', readAt: '2026-12-01T09:30:00Z', controller: { serial: 'KX-0042', firmware: '3.1' }, parameters, ...extra })

describe('drift: read-backs against the signed-off profile', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')

  const car = await newCar(tuner)
  const { profileId, versionId, parameters } = await addOnCarProfile(car.id)
  const readback = (body: unknown, as = tester) => as.call('POST', `/api/vehicles/${car.id}/readback`, body)
  const drifted = async () => (await tuner.call('GET', `/api/vehicles/${car.id}`)).body.driftedAt

  it('records a matching read-back as a match and leaves the car unflagged', async () => {
    const res = await readback({ source: 'file', document: documentFor(car.stockRef, parameters) })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ matches: true, differences: [], versionId, versionNo: 1, source: 'file', profile: { id: profileId, name: 'Road' }, controller: { serial: 'KX-0042' } })
    expect(await drifted()).toBeNull()
  })

  it('treats values within half a step as the same setting (the controller stores on its step grid)', async () => {
    // fenlow-45: powerCapKw steps by 0.5 kW, so 0.2 kW away is the same setting and 0.3 kW is not.
    const near = await readback({ source: 'paste', document: documentFor(car.stockRef, { ...parameters, powerCapKw: parameters.powerCapKw! + 0.2 }) })
    expect(near.body.matches).toBe(true)
  })

  it('flags a difference: the car, the list, the engineers\' bench and their mail all show it', async () => {
    const since = new Date()
    const res = await readback({ source: 'typed', profileId, parameters: { ...parameters, liftOffRegenPct: 60, creepTorqueNm: 0 } }, tuner)
    expect(res.status).toBe(201)
    expect(res.body.matches).toBe(false)
    expect(res.body.differences).toEqual([
      { parameter: 'creepTorqueNm', expected: parameters.creepTorqueNm, found: 0, label: 'Creep torque', expectedWords: `${parameters.creepTorqueNm} N·m`, foundWords: '0 N·m' },
      { parameter: 'liftOffRegenPct', expected: parameters.liftOffRegenPct, found: 60, label: 'Lift-off regen', expectedWords: `${parameters.liftOffRegenPct} %`, foundWords: '60 %' }
    ])
    const flaggedAt = await drifted()
    expect(new Date(flaggedAt).getTime()).toBeGreaterThanOrEqual(since.getTime() - 1000)
    const list = (await tuner.call('GET', `/api/vehicles?q=${car.stockRef}`)).body.items
    expect(list[0].driftedAt).toBe(flaggedAt)
    const bench = (await engineer.call('GET', '/api/drift')).body.items
    expect(bench.find((c: any) => c.id === car.id)).toMatchObject({ stockRef: car.stockRef, differences: res.body.differences })
    const mail = await withDatabase(async c => (await c.query(`SELECT "to", subject, text FROM mail_outbox WHERE subject LIKE $1 ORDER BY "to"`, [`Drift on ${car.stockRef}%`])).rows)
    expect(mail.map(m => m.to)).toEqual(['engineer@voltwright.test', 'lead@voltwright.test'])
    expect(mail[0].text).toContain('Lift-off regen: signed off 15 %, the controller holds 60 %')
    const event = await withDatabase(async c => (await c.query(`SELECT action, "actorId", data FROM audit_events WHERE "vehicleId" = $1 ORDER BY id DESC LIMIT 1`, [car.id])).rows[0])
    expect(event.action).toBe('readback.differs')
    expect(event.data.patch).toEqual([{ op: 'add', path: '/driftedAt', value: flaggedAt }])

    const again = await readback({ source: 'typed', profileId, parameters: { ...parameters, liftOffRegenPct: 61 } })
    expect(again.body.matches).toBe(false)
    expect(await drifted()).toBe(flaggedAt) // drifted since the first difference, not the latest
  })

  it('clears the flag when a later read-back matches, and the history shows both', async () => {
    const res = await readback({ source: 'file', document: documentFor(car.stockRef, parameters) })
    expect(res.body.matches).toBe(true)
    expect(await drifted()).toBeNull()
    expect((await engineer.call('GET', '/api/drift')).body.items.some((c: any) => c.id === car.id)).toBe(false)
    const history = (await auditor.call('GET', `/api/vehicles/${car.id}/history?action=readback.`)).body.items
    expect(history.map((e: any) => e.action)).toEqual(['readback.matched', 'readback.differs', 'readback.differs', 'readback.matched', 'readback.matched'])
    expect(history[0].changes).toEqual([{ path: '/driftedAt', op: 'replace', before: expect.any(String), after: null, beforeKnown: true }])
    const list = (await tester.call('GET', `/api/vehicles/${car.id}/readbacks`)).body
    expect(list.items).toHaveLength(5)
    expect(list.onCar).toEqual([expect.objectContaining({ profileId, versionId, versionNo: 1, name: 'Road' })])
  })

  it('refuses a read-back that is not of this car, not in the format, or names what the car does not have', async () => {
    const wrongCar = await readback({ source: 'paste', document: documentFor('OF-101', parameters) })
    expect(wrongCar.status).toBe(400)
    expect(wrongCar.body.data.fields[0].path).toBe('document.vehicle')
    const wrongFormat = await readback({ source: 'paste', document: { ...documentFor(car.stockRef, parameters), format: 'other/2', readAt: 'Tuesday' } })
    expect(wrongFormat.status).toBe(400)
    expect(wrongFormat.body.data.fields.map((f: any) => f.path).sort()).toEqual(['document.format', 'document.readAt'])
    const unknownParameter = await readback({ source: 'paste', document: documentFor(car.stockRef, { ...parameters, boostKw: 20 }) })
    expect(unknownParameter.status).toBe(400)
    expect(unknownParameter.body.data.fields[0].path).toBe('document.parameters.boostKw')
    const noProfile = await readback({ source: 'paste', document: documentFor(car.stockRef, parameters, { profile: 'Valet' }) })
    expect(noProfile.status).toBe(404)
    const bare = await newCar(tuner)
    await withDatabase(c => c.query(`INSERT INTO profiles ("workshopId", "vehicleId", name) SELECT "workshopId", id, 'Road' FROM vehicles WHERE id = $1`, [bare.id]))
    const notSignedOff = await tester.call('POST', `/api/vehicles/${bare.id}/readback`, { source: 'paste', document: documentFor(bare.stockRef, parameters) })
    expect(notSignedOff.status).toBe(409)
    expect(notSignedOff.body.message).toContain('no signed-off version')
  })

  it('is for tuners and testers of this workshop only', async () => {
    const body = { source: 'file', document: documentFor(car.stockRef, parameters) }
    expect((await readback(body, engineer)).status).toBe(403)
    expect((await readback(body, auditor)).status).toBe(403)
    expect((await readback(body, otherAdmin)).status).toBe(404)
    expect((await readback(body, client)).status).toBe(404)
    expect((await client.call('GET', '/api/drift')).status).toBe(403)
    expect((await otherAdmin.call('GET', '/api/drift')).body.items.some((c: any) => c.id === car.id)).toBe(false)
  })
})
