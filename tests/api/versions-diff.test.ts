import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import jsonpatch from 'fast-json-patch'
import { useRunningServer, signIn } from './helpers'
import { newCar, newProfile, platformSchema, strongRegen } from './version-fixtures'

describe('the diff between two versions', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const otherWorkshop = await signIn('tuner@second.voltwright.test')
  const schema = await platformSchema(tuner)
  const car = await newCar(tuner)
  const a = await newProfile(tuner, car.id, { parameters: { ...Object.fromEntries(Object.entries(schema.properties).map(([k, p]) => [k, p.default])), ...strongRegen } })
  const b = (await tuner.call('POST', `/api/profiles/${a.profileId}/versions`, { fromVersionId: a.id, parameters: { ...a.parameters, powerCapKw: 20, liftOffRegenPct: 10 } })).body
  const diff = await engineer.call('GET', `/api/versions/${a.id}/diff/${b.id}`)

  it('answers {rows, patch, evaluations}, with each setting\'s before, after, change and percent in its schema unit', () => {
    expect(diff.status).toBe(200)
    const power = diff.body.rows.find((r: { name: string }) => r.name === 'powerCapKw')
    // Change in percent = (after − before) / before × 100, worked by hand: (20 − 40) / 40 = −50 %.
    // 40 kW / 745.699872 W per hp = 53.6 hp; 20 kW = 26.8 hp (NIST SP 811)
    expect(power).toEqual({ name: 'powerCapKw', label: schema.properties.powerCapKw!.title, unit: 'kW', before: 40, after: 20, beforeText: '40 kW (54 hp)', afterText: '20 kW (27 hp)', change: -20, changePct: -50, changed: true })
    const regen = diff.body.rows.find((r: { name: string }) => r.name === 'liftOffRegenPct')
    expect(regen).toMatchObject({ before: 70, after: 10, change: -60, unit: '%' })
    expect(regen.changePct).toBeCloseTo(-85.714285714, 6)
    const unchanged = diff.body.rows.filter((r: { changed: boolean }) => !r.changed)
    expect(unchanged.every((r: { change: number }) => r.change === 0)).toBe(true)
    expect(diff.body.rows).toHaveLength(Object.keys(schema.properties).length)
  })

  it('exports a patch that fast-json-patch (an independent RFC 6902 library) applies to version A to give version B', () => {
    const result = jsonpatch.applyPatch(structuredClone(a.parameters), diff.body.patch, true, false).newDocument
    expect(result).toEqual(b.parameters)
    expect(jsonpatch.validate(diff.body.patch, structuredClone(a.parameters))).toBeUndefined()
  })

  it('shows the figures that moved and the warnings that came and went, from the two evaluations', async () => {
    const { a: ea, b: eb } = diff.body.evaluations
    expect(ea.versionId).toBe(a.id)
    expect(eb.versionId).toBe(b.id)
    const accel = diff.body.figures.find((f: { name: string }) => f.name === 'zeroTo50S')
    expect(accel).toMatchObject({ before: ea.figures.zeroTo50S, after: eb.figures.zeroTo50S, unit: 's', changed: true })
    // Half the power cannot make the car quicker.
    expect(accel.after).toBeGreaterThan(accel.before)
    const lift = diff.body.figures.find((f: { name: string }) => f.name === 'liftOffDecelMs2')
    expect(lift.after).toBeLessThan(lift.before)
    const mass = diff.body.figures.find((f: { name: string }) => f.name === 'testMassKg')
    expect(mass).toMatchObject({ changed: false, change: 0 })
    // The same car, so each side equals the version's own evaluation.
    expect((await tuner.call('GET', `/api/versions/${b.id}`)).body.liveEvaluation.figures).toEqual(eb.figures)
    // Lift-off regen fell from 70 % to 10 % of 120 N·m: its snow-grip danger and the stop-lamp duty go;
    // brake regen is unchanged, so its own snow-grip danger stays (one rule, two warnings).
    const snow = (list: { rule: string }[]) => list.filter(w => w.rule === 'regen-grip-snow')
    expect(snow(ea.warnings)).toHaveLength(2)
    expect(snow(eb.warnings)).toHaveLength(1)
    const gone = diff.body.warnings.disappeared
    expect(gone.map((w: { rule: string }) => w.rule).sort()).toEqual(['regen-grip-snow', 'stop-lamp'])
    expect(snow(gone)[0].message).toMatch(/lifting off/)
    expect(diff.body.warnings.kept.map((k: { after: { rule: string, message: string } }) => k.after)).toEqual([expect.objectContaining({ rule: 'regen-grip-snow', message: expect.stringMatching(/brake regen/) })])
    expect(diff.body.warnings.appeared).toEqual([])
    expect(ea.curves.speed.wheelForceN.length).toBeGreaterThan(10)
    expect(Math.max(...eb.curves.speed.powerKw)).toBeLessThanOrEqual(20 + 1e-9)
  })

  it('turns the other way round into the inverse patch, and a version against itself into no change', async () => {
    const back = await engineer.call('GET', `/api/versions/${b.id}/diff/${a.id}`)
    expect(jsonpatch.applyPatch(structuredClone(b.parameters), back.body.patch, true, false).newDocument).toEqual(a.parameters)
    expect(back.body.warnings.appeared.map((w: { rule: string }) => w.rule).sort()).toEqual(['regen-grip-snow', 'stop-lamp'])
    const self = await engineer.call('GET', `/api/versions/${a.id}/diff/${a.id}`)
    expect(self.body.patch).toEqual([])
    expect(self.body.rows.every((r: { changed: boolean }) => !r.changed)).toBe(true)
  })

  it('holds for random pairs of parameter sets (property test, 12 pairs)', async () => {
    const names = Object.keys(schema.properties)
    const arbitrary = fc.record(Object.fromEntries(names.map(n => [n, fc.integer({ min: schema.properties[n]!.minimum, max: schema.properties[n]!.maximum })])) as Record<string, fc.Arbitrary<number>>)
    await fc.assert(fc.asyncProperty(arbitrary, arbitrary, async (pa, pb) => {
      const va = (await tuner.call('POST', `/api/profiles/${a.profileId}/versions`, { parameters: pa })).body
      const vb = (await tuner.call('POST', `/api/profiles/${a.profileId}/versions`, { parameters: pb })).body
      const d = (await engineer.call('GET', `/api/versions/${va.id}/diff/${vb.id}`)).body
      expect(jsonpatch.applyPatch(structuredClone(pa), d.patch, true, false).newDocument).toEqual(pb)
      for (const row of d.rows) expect(row.change).toBeCloseTo(pb[row.name]! - pa[row.name]!, 9)
    }), { numRuns: 12 })
  })

  it('refuses versions of another workshop and malformed ids', async () => {
    expect((await otherWorkshop.call('GET', `/api/versions/${a.id}/diff/${b.id}`)).status).toBe(404)
    expect((await engineer.call('GET', `/api/versions/${a.id}/diff/99999999`)).status).toBe(404)
    expect((await engineer.call('GET', `/api/versions/${a.id}/diff/x`)).status).toBe(400)
  })
})
