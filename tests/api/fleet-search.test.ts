import { describe, it, expect } from 'vitest'
import { setTimeout as sleep } from 'node:timers/promises'
import { useRunningServer, signIn } from './helpers'
import { addOnCarProfile, addWorkshop, fenlowParameters, newCar, testSpec } from './fixtures'

describe('fleet search over the cars\' on-car settings and what they do', async () => {
  await useRunningServer()
  const bay = await addWorkshop({ admin: ['admin'], engineer: ['engineer'] })
  const admin = await signIn(bay.emails.admin!)
  const engineer = await signIn(bay.emails.engineer!)
  const strong = { ...fenlowParameters(), regenTorqueLimitNm: 120, liftOffRegenPct: 70 }
  const gentle = { ...fenlowParameters(), regenTorqueLimitNm: 60, liftOffRegenPct: 10 }
  // A make a spreadsheet would run as a formula, for the export.
  const rearStrong = await newCar(admin, { make: '=HYPERLINK("x")' })
  const rearGentle = await newCar(admin)
  const frontStrong = await newCar(admin, { spec: { ...testSpec, drivenAxle: 'front', frontAxleLoadPct: 60 } })
  await addOnCarProfile(rearStrong.id, { parameters: strong })
  await addOnCarProfile(rearGentle.id, { parameters: gentle })
  await addOnCarProfile(frontStrong.id, { parameters: strong })
  const run = (await engineer.call('POST', '/api/fleet/recheck', {})).body
  for (let i = 0; i < 120 && (await engineer.call('GET', '/api/fleet/recheck')).body.state !== 'done'; i++) await sleep(250)
  const search = (body: unknown) => engineer.call('POST', '/api/fleet/search', body)
  const refs = (items: { stockRef: string }[]) => items.map(i => i.stockRef).sort()

  it('finds the rear-driven cars whose lift-off deceleration at 50 km/h exceeds the snow grip limit', async () => {
    expect(run.total).toBe(3)
    const res = await search({ conditions: [{ field: 'spec.drivenAxle', op: 'eq', value: 'rear' }, { field: 'figure.liftOffOverSnowGripMs2', op: 'gt', value: 0 }] })
    expect(res.status).toBe(200)
    expect(res.body.total).toBe(1)
    expect(refs(res.body.items)).toEqual([rearStrong.stockRef])
    const item = res.body.items[0]
    expect(item.values['figure.liftOffOverSnowGripMs2']).toBeGreaterThan(0)
    expect(item.warnings).toContain('regen-grip-snow')
  })

  it('searches settings by role across drive units, and by name within one unit', async () => {
    expect(refs((await search({ conditions: [{ field: 'setting.liftOffRegenPct', op: 'ge', value: 50 }, { field: 'spec.kerbMassKg', op: 'lt', value: 2000 }, { field: 'car.year', op: 'in', value: [1966] }] })).body.items))
      .toEqual([rearStrong.stockRef, frontStrong.stockRef].sort())
    expect((await search({ conditions: [{ field: 'unit.fenlow-45.liftOffRegenPct', op: 'ge', value: 50 }] })).body.total).toBe(2)
    expect((await search({ conditions: [{ field: 'unit.marrick-110.liftOffRegenPct', op: 'ge', value: 50 }] })).body.total).toBe(0)
    expect(refs((await search({ conditions: [{ field: 'warning', op: 'ne', value: 'regen-grip-snow' }] })).body.items)).toEqual([rearGentle.stockRef])
  })

  it('pages with a cursor in the order asked, each car once', async () => {
    const seen: { stockRef: string, values: Record<string, number> }[] = []
    let cursor: string | undefined
    for (let page = 0; page < 5; page++) {
      const res = await search({ conditions: [{ field: 'figure.liftOffDecelMs2', op: 'ge', value: 0 }], sort: { field: 'figure.liftOffDecelMs2', dir: 'desc' }, limit: 1, cursor })
      expect(res.body.total).toBe(3)
      seen.push(...res.body.items)
      cursor = res.body.nextCursor ?? undefined
      if (!cursor) break
    }
    expect(seen).toHaveLength(3)
    expect(new Set(seen.map(s => s.stockRef)).size).toBe(3)
    const decel = seen.map(s => s.values['figure.liftOffDecelMs2']!)
    expect(decel).toEqual([...decel].sort((a, b) => b - a))
  })

  it('refuses fields it does not know, values of the wrong kind and broken cursors, without running them', async () => {
    for (const body of [
      { conditions: [{ field: 'spec.kerbMassKg\'); DROP TABLE vehicles; --', op: 'gt', value: 1 }] },
      { conditions: [{ field: 'unit.fenlow-45.notASetting', op: 'gt', value: 1 }] },
      { conditions: [{ field: 'car.make', op: 'lt', value: 'M' }] },
      { conditions: [{ field: 'spec.kerbMassKg', op: 'gt', value: 'heavy' }] },
      { conditions: [{ field: 'spec.kerbMassKg', op: 'in', value: 5 }] },
      { conditions: [], cursor: 'not-a-cursor' },
      { conditions: [], sort: { field: 'warning' } }
    ]) expect((await search(body)).status, JSON.stringify(body)).toBe(400)
  })

  it('keeps each workshop\'s cars to itself', async () => {
    const demo = await signIn('engineer@voltwright.test')
    const res = await demo.call('POST', '/api/fleet/search', { conditions: [{ field: 'car.make', op: 'eq', value: '=HYPERLINK("x")' }] })
    expect(res.body.total).toBe(0)
  })

  it('exports the results as CSV with every cell quoted and formulas neutralised', async () => {
    const res = await engineer.call('POST', '/api/fleet/search.csv', { conditions: [{ field: 'spec.drivenAxle', op: 'eq', value: 'rear' }, { field: 'figure.liftOffOverSnowGripMs2', op: 'gt', value: 0 }] })
    expect(res.status).toBe(200)
    const text = String(res.body)
    const lines = text.trim().split('\r\n')
    expect(lines).toHaveLength(2)
    for (const line of lines) expect(line).toMatch(/^"(?:[^"]|"")*"(?:,"(?:[^"]|"")*")*$/)
    expect(text).toContain('"\'=HYPERLINK(""x"")"')
    expect(text).not.toMatch(/(^|,)"=/m)
  })
})
