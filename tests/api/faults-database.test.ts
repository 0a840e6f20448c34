import { describe, it, expect, afterAll } from 'vitest'
import { useRunningServer, signIn, withDatabase, unique } from './helpers'
import { startServer, stopServer, stopServerAsync } from '../../scripts/lib/postgres.mjs'

const pgDir = process.env.VOLTWRIGHT_PG_DIR!
const pgPort = Number(process.env.VOLTWRIGHT_PG_PORT)

describe('PostgreSQL stopped while requests flow', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const carId = (await tuner.call('GET', '/api/vehicles')).body.items[0].id
  afterAll(() => { startServer(pgDir, pgPort) })

  it('answers 503 with a plain message while it is down, and recovers by itself when it is back', async () => {
    const before = await tuner.call('GET', `/api/vehicles/${carId}`)
    expect(before.status).toBe(200)

    stopServer(pgDir)
    const read = await tuner.call('GET', `/api/vehicles/${carId}`)
    const write = await tuner.call('PATCH', `/api/vehicles/${carId}`, { registration: 'DOWN 503' })
    for (const res of [read, write]) {
      expect(res.status).toBe(503)
      expect(res.body.message).toMatch(/database cannot be reached/)
      expect(JSON.stringify(res.body)).not.toMatch(/ECONNREFUSED|Sequelize|SELECT/)
    }

    startServer(pgDir, pgPort)
    let status = 0
    for (let i = 0; i < 40 && status !== 200; i++) {
      status = (await tuner.call('GET', `/api/vehicles/${carId}`)).status
      if (status !== 200) await new Promise(r => setTimeout(r, 250))
    }
    expect(status).toBe(200)
    // The write refused while the database was down never happened.
    expect((await tuner.call('GET', `/api/vehicles/${carId}`)).body.registration).not.toBe('DOWN 503')
  })

  it('loses no committed change and half-writes none when the database stops mid-flow', async () => {
    const platformKey = (await tuner.call('GET', '/api/platforms')).body.items[0].key
    const spec = (await tuner.call('GET', `/api/vehicles/${carId}`)).body.spec
    const prefix = unique('XF').slice(0, 12)
    const create = (i: number) => tuner.call('POST', '/api/vehicles', { stockRef: `${prefix}-${i}`, make: 'Faultby', model: 'Survivor', year: 1970, platformKey, spec })
    // Four writers keep creating cars; PostgreSQL is stopped once a few have committed, while others are in flight.
    const answers: Awaited<ReturnType<typeof create>>[] = []
    let next = 0
    let stopped: Promise<void> | null = null
    const writer = async () => {
      while (next < 400) {
        const answer = await create(next++)
        answers.push(answer)
        if (!stopped && answers.filter(a => a.status === 201).length >= 3) stopped = stopServerAsync(pgDir)
        if (stopped && answers.filter(a => a.status === 503).length >= 4) return
      }
    }
    await Promise.all([writer(), writer(), writer(), writer()])
    await stopped
    startServer(pgDir, pgPort)
    expect(answers.map(a => a.status).filter(s => s !== 201 && s !== 503)).toEqual([])
    expect(answers.some(a => a.status === 503)).toBe(true)
    const created = answers.filter(a => a.status === 201).map(a => a.body.stockRef)
    expect(created.length).toBeGreaterThan(0)
    const rows = await withDatabase(async c => (await c.query(
      `SELECT v."stockRef", count(a.id)::int AS events FROM vehicles v LEFT JOIN audit_events a ON a."vehicleId" = v.id AND a.action = 'vehicle.created'
       WHERE v."stockRef" LIKE $1 GROUP BY v."stockRef"`, [`${prefix}-%`])).rows)
    // Every answered 201 is there; nothing is there without its audit event.
    expect(rows.map(r => r.stockRef).sort()).toEqual(expect.arrayContaining(created.sort()))
    expect(rows.every(r => r.events === 1)).toBe(true)
  })
})
