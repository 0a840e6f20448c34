import { describe, it, expect } from 'vitest'
import { setTimeout as sleep } from 'node:timers/promises'
import { useRunningServer, signIn, withDatabase } from './helpers'

const rank = { info: 1, caution: 2, danger: 3 } as const
type Car = { stockRef: string, newWarnings: { rule: string, severity: keyof typeof rank }[] }

describe('re-checking every car\'s on-car settings in the background', async () => {
  await useRunningServer()
  const engineer = await signIn('engineer@voltwright.test')
  const admin = await signIn('admin@voltwright.test')
  const workshopId = await withDatabase(async c => (await c.query(`SELECT "workshopId" FROM users WHERE email = 'engineer@voltwright.test'`)).rows[0].workshopId as number)
  const onCar = await withDatabase(async c => Number((await c.query(`SELECT count(*) AS n FROM profiles p JOIN vehicles v ON v.id = p."vehicleId" WHERE v."workshopId" = $1 AND p."onCarVersionId" IS NOT NULL`, [workshopId])).rows[0].n))
  const finished = async (id: number) => {
    for (let i = 0; i < 240; i++) {
      const res = await engineer.call('GET', '/api/fleet/recheck')
      expect(res.status).toBe(200)
      if (res.body.id === id && res.body.state === 'done') return res.body
      await sleep(250)
    }
    throw new Error(`re-check ${id} did not finish`)
  }
  const latestId = async () => (await engineer.call('GET', '/api/fleet/recheck')).body.id as number

  it('re-checks each car with settings on it when asked, counts its progress, and records the result in each car\'s history', async () => {
    expect(onCar).toBeGreaterThan(0)
    const started = await engineer.call('POST', '/api/fleet/recheck', {})
    expect(started.status).toBe(202)
    expect(started.body.total).toBe(onCar)
    const run = await finished(started.body.id)
    expect(run).toMatchObject({ state: 'done', reason: 'asked', done: onCar, total: onCar })
    const events = await withDatabase(async c => (await c.query(`SELECT "vehicleId", data FROM audit_events WHERE action = 'fleet.rechecked' AND data->>'recheckId' = $1`, [String(run.id)])).rows)
    expect(events).toHaveLength(onCar)
    expect(events.every(e => e.vehicleId && ['new warnings', 'no new warnings'].includes(e.data.result))).toBe(true)
    expect((await admin.call('POST', '/api/fleet/recheck', { now: true })).status).toBe(400)
  })

  it('re-checks when a threshold changes, lists the cars with new warnings worst first, and mails the engineers once', async () => {
    const before = (await admin.call('GET', '/api/workshop')).body.settings.minStartGradePct
    const since = new Date()
    try {
      // No car can start on a 60 % gradient: every car on the road now raises the hill-start warning.
      expect((await admin.call('PATCH', '/api/workshop/settings', { minStartGradePct: 60 })).status).toBe(200)
      const run = await finished(await latestId())
      expect(run.reason).toBe('thresholds')
      expect(run.cars.length).toBeGreaterThan(0)
      for (const car of run.cars as Car[]) expect(car.newWarnings.map(w => w.rule)).toContain('hill-start')
      const worst = (run.cars as Car[]).map(c => Math.max(...c.newWarnings.map(w => rank[w.severity])))
      expect(worst).toEqual([...worst].sort((a, b) => b - a))
      const mails = await withDatabase(async c => (await c.query(`SELECT "to", text FROM mail_outbox WHERE subject LIKE 'Fleet re-check:%' AND "createdAt" >= $1 AND "workshopId" = $2`, [since, workshopId])).rows)
      const engineers = await withDatabase(async c => (await c.query(`SELECT email FROM users WHERE "workshopId" = $1 AND active AND 'engineer' = ANY(roles) ORDER BY email`, [workshopId])).rows.map(r => r.email))
      expect(mails.map(m => m.to).sort()).toEqual(engineers)
      expect(mails[0].text).toContain((run.cars as Car[])[0]!.stockRef)
    } finally {
      expect((await admin.call('PATCH', '/api/workshop/settings', { minStartGradePct: before })).status).toBe(200)
      await finished(await latestId())
    }
  })

  it('does not re-check when only the display units change', async () => {
    const id = await latestId()
    const units = (await admin.call('GET', '/api/workshop')).body.settings.units
    expect((await admin.call('PATCH', '/api/workshop/settings', { units: { ...units, speed: units.speed === 'mph' ? 'km/h' : 'mph' } })).status).toBe(200)
    expect((await admin.call('PATCH', '/api/workshop/settings', { units })).status).toBe(200)
    expect(await latestId()).toBe(id)
  })
})
