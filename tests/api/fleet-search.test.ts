import { describe, it, expect } from 'vitest'
import { setTimeout as sleep } from 'node:timers/promises'
import { useRunningServer, signIn } from './helpers'
import { defaultParameters, findPlatform } from '../../shared/platforms'
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
  // Two drive units that name and scale the lift-off regen their own way: "coast regen" in %, and a fraction.
  const unitDefaults = (key: string) => defaultParameters(findPlatform(key)!) as Record<string, number>
  // Front-driven, so the rear-driven example below keeps to the fenlow cars.
  const frontSpec = { spec: { ...testSpec, drivenAxle: 'front', frontAxleLoadPct: 60 } }
  const corvathCar = await newCar(admin, { platformKey: 'corvath-130', ...frontSpec })
  const peltryCar = await newCar(admin, { platformKey: 'peltry-70', ...frontSpec })
  await addOnCarProfile(corvathCar.id, { parameters: { ...unitDefaults('corvath-130'), coastRegenPct: 60 } })
  await addOnCarProfile(peltryCar.id, { parameters: { ...unitDefaults('peltry-70'), liftOffRegen: 0.55 } })
  const run = (await engineer.call('POST', '/api/fleet/recheck', {})).body
  for (let i = 0; i < 120 && (await engineer.call('GET', '/api/fleet/recheck')).body.state !== 'done'; i++) await sleep(250)
  const search = (body: unknown) => engineer.call('POST', '/api/fleet/search', body)
  const refs = (items: { stockRef: string }[]) => items.map(i => i.stockRef).sort()

  it('finds the rear-driven cars whose lift-off deceleration at 50 km/h exceeds the snow grip limit', async () => {
    expect(run.total).toBe(5)
    const res = await search({ conditions: [{ field: 'spec.drivenAxle', op: 'eq', value: 'rear' }, { field: 'figure.liftOffOverSnowGripMs2', op: 'gt', value: 0 }] })
    expect(res.status).toBe(200)
    expect(res.body.total).toBe(1)
    expect(refs(res.body.items)).toEqual([rearStrong.stockRef])
    const item = res.body.items[0]
    expect(item.values['figure.liftOffOverSnowGripMs2']).toBeGreaterThan(0)
    expect(item.warnings).toContain('regen-grip-snow')
  })

  it('searches settings by role across drive units, each in the role\'s own unit, and by name within one unit', async () => {
    const byRole = await search({ conditions: [{ field: 'setting.liftOffRegenPct', op: 'ge', value: 50 }, { field: 'spec.kerbMassKg', op: 'lt', value: 2000 }, { field: 'car.year', op: 'in', value: [1966] }] })
    expect(refs(byRole.body.items)).toEqual([rearStrong.stockRef, frontStrong.stockRef, corvathCar.stockRef, peltryCar.stockRef].sort())
    // 0.55 of the regen torque on the fraction unit reads as 55 % (the role's own unit).
    expect(byRole.body.items.find((i: { stockRef: string }) => i.stockRef === peltryCar.stockRef).values['setting.liftOffRegenPct']).toBeCloseTo(55, 6)
    expect((await search({ conditions: [{ field: 'unit.fenlow-45.liftOffRegenPct', op: 'ge', value: 50 }] })).body.total).toBe(2)
    expect((await search({ conditions: [{ field: 'unit.marrick-110.liftOffRegenPct', op: 'ge', value: 50 }] })).body.total).toBe(0)
    expect(refs((await search({ conditions: [{ field: 'unit.corvath-130.coastRegenPct', op: 'ge', value: 50 }] })).body.items)).toEqual([corvathCar.stockRef])
    expect(refs((await search({ conditions: [{ field: 'unit.peltry-70.liftOffRegen', op: 'gt', value: 0.5 }] })).body.items)).toEqual([peltryCar.stockRef])
    expect(refs((await search({ conditions: [{ field: 'car.driveUnit', op: 'in', value: ['corvath-130', 'peltry-70'] }] })).body.items)).toEqual([corvathCar.stockRef, peltryCar.stockRef].sort())
    expect(refs((await search({ conditions: [{ field: 'warning', op: 'ne', value: 'regen-grip-snow' }, { field: 'car.driveUnit', op: 'eq', value: 'fenlow-45' }] })).body.items)).toEqual([rearGentle.stockRef])
  })

  it('pages with a cursor in the order asked, each car once', async () => {
    const seen: { stockRef: string, values: Record<string, number> }[] = []
    let cursor: string | undefined
    for (let page = 0; page < 8; page++) {
      const res = await search({ conditions: [{ field: 'figure.liftOffDecelMs2', op: 'ge', value: 0 }], sort: { field: 'figure.liftOffDecelMs2', dir: 'desc' }, limit: 1, cursor })
      expect(res.body.total).toBe(5)
      seen.push(...res.body.items)
      cursor = res.body.nextCursor ?? undefined
      if (!cursor) break
    }
    expect(seen).toHaveLength(5)
    expect(new Set(seen.map(s => s.stockRef)).size).toBe(5)
    const decel = seen.map(s => s.values['figure.liftOffDecelMs2']!)
    expect(decel).toEqual([...decel].sort((a, b) => b - a))
  })

  it('refuses fields it does not know, values of the wrong kind, costly input and broken cursors, without running them', async () => {
    const marker = (v: unknown) => Buffer.from(JSON.stringify({ v, id: 1 })).toString('base64url')
    for (const body of [
      { conditions: [{ field: 'unit.corvath-130.liftOffRegenPct', op: 'gt', value: 1 }] }, // not a setting of that unit
      { conditions: [{ field: 'unit.nowhere-9.powerCapKw', op: 'gt', value: 1 }] },
      { conditions: [{ field: 'unit.fenlow-45.power Cap', op: 'gt', value: 1 }] },
      { conditions: [{ field: 'car.year', op: 'in', value: Array.from({ length: 51 }, (_, i) => 1900 + i) }] },
      { conditions: Array.from({ length: 13 }, () => ({ field: 'car.year', op: 'gt', value: 1900 })) },
      { conditions: [], limit: 501 },
      { conditions: [], sort: { field: 'unit.fenlow-45.powerCapKw' } },
      { conditions: [], sort: { field: 'figure.topSpeedKph' }, cursor: marker('1; DROP TABLE vehicles') },
      { conditions: [], sort: { field: 'figure.topSpeedKph' }, cursor: marker(['x']) },
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

  it('sorts by a fact that has no index of its own, and words a setting of one unit and the drive unit in the CSV', async () => {
    const sorted = await search({ conditions: [], sort: { field: 'spec.wheelbaseMm', dir: 'desc' }, limit: 2 })
    expect(sorted.status).toBe(200)
    expect(sorted.body.total).toBe(5)
    expect(sorted.body.nextCursor).toEqual(expect.any(String))
    const res = await engineer.call('POST', '/api/fleet/search.csv', { conditions: [{ field: 'unit.corvath-130.coastRegenPct', op: 'ge', value: 50 }, { field: 'car.driveUnit', op: 'eq', value: 'corvath-130' }] })
    const [head, row] = String(res.body).trim().split('\r\n')
    expect(head).toContain('"Coast regen on the Corvath 130 (%)"')
    expect(head).toContain('"Drive unit"')
    expect(row).toContain('"Corvath 130"')
    expect(String(res.body)).not.toContain('corvath-130')
  })
})
