import { describe, it, expect } from 'vitest'
import pg from 'pg'
import { Sequelize } from 'sequelize'
import { useRunningServer, signIn, withDatabase, type Caller } from './helpers'
import { addWorkshop } from './fixtures'
import { appendAuditEvent, appendDatedAuditEvents } from '../../server/utils/history/audit'
import { demoCars, moreDemoCars } from '../../seeders/demo-cars'
import { demoKits } from '../../seeders/demo-kits'

interface Event { id: string, createdAt: string, action: string, entityType: string, entityId: string, vehicle: { id: number, stockRef: string } | null, details: Record<string, unknown> }

async function everyEvent(as: Caller, path: string): Promise<Event[]> {
  const events: Event[] = []
  let cursor: string | null = null
  do {
    const page: { items: Event[], nextCursor: string | null } = (await as.call('GET', `${path}${path.includes('?') ? '&' : '?'}limit=200${cursor ? `&cursor=${cursor}` : ''}`)).body
    events.push(...page.items)
    cursor = page.nextCursor
  } while (cursor)
  return events.reverse() // oldest first, as the chain runs
}

const time = (at: string | Date) => new Date(at).getTime()
const day = (at: string | Date) => new Date(at).toISOString().slice(0, 10)

// What each kind of event records, and when that thing happened by its own record.
const RECORDED = `
  SELECT 'vehicle' AS kind, id::text, "createdAt" AS at FROM vehicles WHERE "workshopId" = $1
  UNION ALL SELECT 'version.created', id::text, "createdAt" FROM profile_versions WHERE "workshopId" = $1
  UNION ALL SELECT 'version.submitted', id::text, "submittedAt" FROM profile_versions WHERE "workshopId" = $1 AND "submittedAt" IS NOT NULL
  UNION ALL SELECT 'review', id::text, "createdAt" FROM reviews WHERE "workshopId" = $1
  UNION ALL SELECT 'road-test', id::text, "createdAt" FROM road_tests WHERE "workshopId" = $1
  UNION ALL SELECT 'signed', id::text, (signed->>'at')::timestamptz FROM road_tests WHERE "workshopId" = $1 AND signed IS NOT NULL
  UNION ALL SELECT 'signed-version', "versionId"::text, (signed->>'at')::timestamptz FROM road_tests WHERE "workshopId" = $1 AND signed IS NOT NULL
  UNION ALL SELECT 'snag', id::text, "createdAt" FROM snags WHERE "workshopId" = $1
  UNION ALL SELECT 'readback', id::text, "createdAt" FROM readbacks WHERE "workshopId" = $1`

// The demo's history is dated as its story (seeders/demo-story.ts), and so is everything written after it.
describe('the demo workshop\'s history, dated when each thing happened', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')
  const events = await everyEvent(auditor, '/api/audit/events')
  const workshopId = await withDatabase(async c => (await c.query('SELECT "workshopId" FROM users WHERE email = $1', ['auditor@voltwright.test'])).rows[0].workshopId as number)
  const recorded = new Map((await withDatabase(c => c.query(RECORDED, [workshopId]))).rows.map(r => [`${r.kind}:${r.id}`, r.at as Date]))

  it('reads in date order: no event before the one it follows, none in the future, and the chain still verifies', async () => {
    expect(events.length).toBeGreaterThan(70)
    for (const [i, e] of events.entries()) {
      if (i > 0) expect(time(e.createdAt), `event ${e.id} (${e.action}) after event ${events[i - 1]!.id}`).toBeGreaterThanOrEqual(time(events[i - 1]!.createdAt))
      expect(time(e.createdAt), `event ${e.id}`).toBeLessThanOrEqual(Date.now())
    }
    const verify = (await auditor.call('GET', '/api/audit/verify')).body
    expect(verify).toMatchObject({ ok: true, firstBroken: null })
    expect(verify.checked).toBeGreaterThanOrEqual(events.length)
  })

  it('tells the demo over weeks, not at the moment it was seeded', async () => {
    const days = new Set(events.map(e => day(e.createdAt)))
    expect(days.size).toBeGreaterThanOrEqual(25)
    expect(time(events.at(-1)!.createdAt) - time(events[0]!.createdAt)).toBeGreaterThan(60 * 86_400_000)
  })

  it('gives each demo car\'s history in date order, starting when the car came in', async () => {
    const refs = new Set([...demoCars, ...moreDemoCars, ...demoKits.flatMap(k => k.cars.map(c => c.car))].map(c => c.stockRef))
    const cars = [...new Set(events.filter(e => e.vehicle && refs.has(e.vehicle.stockRef)).map(e => e.vehicle!.id))]
    expect(cars).toHaveLength(refs.size)
    for (const id of cars) {
      const history = await everyEvent(auditor, `/api/vehicles/${id}/history`)
      expect(history[0]!.action, `car ${id}`).toBe('vehicle.created')
      for (const [i, e] of history.entries()) {
        if (i > 0) expect(time(e.createdAt), `car ${id}, event ${e.id} (${e.action})`).toBeGreaterThanOrEqual(time(history[i - 1]!.createdAt))
      }
    }
  })

  it('dates each event the day of what it records: a version\'s approval the day the version says it was approved', async () => {
    const checked = new Set<string>()
    const sameDay = (e: Event, key: string) => {
      const at = recorded.get(key)
      expect(at, `${e.action} ${e.entityId}: nothing recorded as ${key}`).toBeDefined()
      expect(day(e.createdAt), `${e.action} ${e.entityId} (${key})`).toBe(day(at!))
      checked.add(e.action)
    }
    for (const e of events) {
      if (e.action === 'vehicle.created') sameDay(e, `vehicle:${e.entityId}`)
      if (e.action === 'version.created' || e.action === 'version.submitted') sameDay(e, `${e.action}:${e.entityId}`)
      if (e.action === 'version.approved' || e.action === 'version.rejected') sameDay(e, `review:${e.details.reviewId ?? ''}`)
      if (e.action === 'road-test.recorded') sameDay(e, `road-test:${e.entityId}`)
      if (e.action === 'version.signed-off') sameDay(e, e.details.roadTestId ? `signed:${e.details.roadTestId}` : `signed-version:${e.entityId}`)
      if (e.action === 'snag.created') sameDay(e, `snag:${e.entityId}`)
      if (e.action.startsWith('readback.')) sameDay(e, `readback:${e.entityId}`)
    }
    expect([...checked].sort()).toEqual(expect.arrayContaining(['readback.differs', 'readback.matched', 'road-test.recorded', 'snag.created', 'vehicle.created', 'version.approved', 'version.created', 'version.rejected', 'version.signed-off', 'version.submitted']))
    // The version's own page says when it was approved: the same day as its approval in the history.
    const approvals = events.filter(e => e.action === 'version.approved')
    for (const e of approvals.slice(0, 12)) {
      const version = (await auditor.call('GET', `/api/versions/${e.entityId}`)).body
      expect(day(version.decidedAt), `version ${e.entityId}`).toBe(day(e.createdAt))
    }
  })

  it('keeps each version\'s story in order: proposed, sent for review, decided, road-tested, signed off', async () => {
    const order = ['version.created', 'version.submitted', 'version.approved', 'road-test.recorded', 'version.signed-off']
    const byVersion = new Map<string, Event[]>()
    for (const e of events) {
      const versionId = e.action === 'road-test.recorded' ? String(e.details.versionId ?? '') : e.entityType === 'version' ? e.entityId : ''
      if (!versionId || !order.includes(e.action)) continue
      byVersion.set(versionId, [...(byVersion.get(versionId) ?? []), e])
    }
    let roadTested = 0
    for (const [versionId, story] of byVersion) {
      const steps = story.map(e => order.indexOf(e.action))
      expect(steps, `version ${versionId}: ${story.map(e => e.action).join(', ')}`).toEqual([...steps].sort((a, b) => a - b))
      if (story.some(e => e.action === 'road-test.recorded')) roadTested++
    }
    expect(roadTested).toBeGreaterThanOrEqual(3)
  })

  // Only the seed dates events (seeders/demo-story.ts), and even it cannot slip one in behind the chain's head.
  describe('dated events', async () => {
    const bay = await addWorkshop({ auditor: ['auditor'] })
    const sequelize = new Sequelize(process.env.DATABASE_URL!, { dialect: 'postgres', dialectModule: pg, logging: false })
    const event = (entityId: number) => ({ workshopId: bay.workshopId, action: 'vehicle.updated', entityType: 'vehicle', entityId, data: {} })
    const dated = (at: Date, ...ids: number[]) => sequelize.transaction(t => appendDatedAuditEvents(t, bay.workshopId, ids.map(id => ({ ...event(id), at }))))

    it('go on the chain in date order from its head up to now, and never before it or in the future', async () => {
      const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000)
      try {
        const monthAgo = daysAgo(30)
        const written = await dated(monthAgo, 1, 2)
        expect(written.map(e => new Date(e.createdAt).getTime())).toEqual([monthAgo.getTime(), monthAgo.getTime()])
        await expect(dated(daysAgo(31), 3)).rejects.toThrow(/not between the chain's newest event and now/)
        await expect(dated(new Date(Date.now() + 60_000), 4)).rejects.toThrow(/not between/)
        await expect(sequelize.transaction(t => appendDatedAuditEvents(t, bay.workshopId, [{ ...event(5), at: daysAgo(10) }, { ...event(6), at: daysAgo(20) }]))).rejects.toThrow(/in order/)
        // An ordinary writer's event is stamped now, whatever date its input carries.
        const stamped = await sequelize.transaction(t => appendAuditEvent(t, { ...event(7), at: daysAgo(100) } as Parameters<typeof appendAuditEvent>[1]))
        expect(Date.now() - new Date(stamped.createdAt).getTime()).toBeLessThan(600_000)
        await expect(dated(daysAgo(1), 8)).rejects.toThrow(/not between/)
      } finally {
        await sequelize.close()
      }
      const auditor = await signIn(bay.emails.auditor!)
      expect((await auditor.call('GET', '/api/audit/verify')).body).toMatchObject({ ok: true, checked: 3, firstBroken: null })
    })
  })
})
