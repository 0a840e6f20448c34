import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { addOnCarProfile, addPerson, addSnag, fenlowParameters, newCar } from './fixtures'

describe('a car owner sees their own cars and nothing else', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const person = await addPerson(['client'], 'Ottoline Marsh')
  const client = await signIn(person.email)
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const owner = person.id

  const mine = await newCar(tuner)
  await withDatabase(c => c.query('UPDATE vehicles SET "ownerUserId" = $1, status = $2 WHERE id = $3', [owner, 'handed-over', mine.id]))
  const parameters = { ...fenlowParameters(), powerCapKw: 40, creepTorqueNm: 0, liftOffRegenPct: 10, speedLimitKph: 112 }
  await addOnCarProfile(mine.id, { parameters, roadTest: 'pass' })
  await addSnag(mine.id, 'enhancement', 'Period-correct leather seat covers')
  await addSnag(mine.id, 'enhancement', 'Heated windscreen', 'declined')
  await addSnag(mine.id, 'conversion', 'Inverter coolant hose chafing on the subframe')
  const notMine = await newCar(tuner)

  it('shows the car\'s stage, its settings in plain words, the road test, open faults and enhancements, and the handover sheet', async () => {
    const res = await client.call('GET', `/api/vehicles/${mine.id}/client-view`)
    expect(res.status).toBe(200)
    expect(res.body.car).toMatchObject({ id: mine.id, status: 'handed-over', statusLabel: 'Handed over' })
    // 40 kW = 53.6 hp at 745.69987158 W per hp (NIST SP 811); 112 km/h = 69.6 mph (1.609344 km/mi, NIST SP 811)
    expect(res.body.onCar).toEqual([{ profile: 'Road', versionNo: 1, words: expect.arrayContaining(['power limited to 40 kW (54 hp)', 'top speed limited to 112 km/h (70 mph)', 'creep off']) }])
    expect(res.body.onCar[0].words.some((w: string) => /lift-off regen/.test(w))).toBe(true)
    expect(res.body.roadTest).toEqual({ testedAt: '2026-11-20T10:00:00.000Z', verdict: 'pass', surface: 'wet' })
    expect(res.body.enhancements.map((s: any) => s.title)).toEqual(['Period-correct leather seat covers'])
    // A fault still open is the owner's to know of, by its title and priority; the workshop's notes on it are not.
    expect(res.body.openWork).toEqual([{ id: expect.any(Number), title: 'Inverter coolant hose chafing on the subframe', priority: 'Normal' }])
    expect(res.body.openWorkAdvice).toBe('The workshop will arrange these with you.')
    expect(res.body.handoverPdf).toBe(`/api/vehicles/${mine.id}/handover.pdf`)
  })

  it('warns the owner when the controller was read and did not hold the signed-off settings', async () => {
    expect((await client.call('GET', `/api/vehicles/${mine.id}/client-view`)).body.drift).toBeNull()
    const tester = await signIn('tester@voltwright.test')
    const profileId = (await withDatabase(c => c.query('SELECT id FROM profiles WHERE "vehicleId" = $1', [mine.id]))).rows[0].id
    const read = await tester.call('POST', `/api/vehicles/${mine.id}/readback`, { source: 'typed', profileId, parameters: { ...parameters, liftOffRegenPct: 60 } })
    expect(read.status).toBe(201)
    expect(read.body.matches).toBe(false)
    const res = await client.call('GET', `/api/vehicles/${mine.id}/client-view`)
    expect(Date.parse(res.body.drift.since)).toBeGreaterThan(Date.now() - 60_000)
    expect(JSON.stringify(res.body)).not.toContain('liftOffRegenPct') // what differs stays with the workshop
  })

  it('carries no workshop internals', async () => {
    const text = JSON.stringify((await client.call('GET', `/api/vehicles/${mine.id}/client-view`)).body)
    for (const internal of ['rationale', 'authorId', 'testerId', 'parameters', 'Dev Carrow', 'Sol Brannagh', 'contentHash', 'spec']) {
      expect(text, internal).not.toContain(internal)
    }
  })

  it('answers 404 for any other car, and keeps the history, read-backs and drift list from the owner', async () => {
    for (const path of [`/api/vehicles/${notMine.id}/client-view`, `/api/vehicles/${notMine.id}`, `/api/vehicles/${notMine.id}/history`, `/api/vehicles/${notMine.id}/readbacks`]) {
      expect((await client.call('GET', path)).status, path).toBe(404)
    }
    expect((await client.call('GET', '/api/vehicles/999999/client-view')).status).toBe(404)
    expect((await otherAdmin.call('GET', `/api/vehicles/${mine.id}/client-view`)).status).toBe(404)
    expect((await client.call('GET', `/api/vehicles/${mine.id}/history`)).status).toBe(403)
    expect((await client.call('GET', `/api/vehicles/${mine.id}/readbacks`)).status).toBe(403)
    expect((await client.call('POST', `/api/vehicles/${mine.id}/readback`, {})).status).toBe(403)
    const list = (await client.call('GET', '/api/vehicles?pageSize=100')).body.items
    expect(list.map((v: any) => v.id)).toContain(mine.id)
    expect(list.every((v: any) => v.ownerUserId === owner)).toBe(true)
  })
})
