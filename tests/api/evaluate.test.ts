import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { useRunningServer, signIn, anonymous } from './helpers'
import { defaultParameters, fenlow45 } from '../../shared/platforms'
import { STANDARD_GRAVITY } from '../../shared/compute/units'
import { demoCars } from '../../seeders/demo-cars'

const of101 = demoCars.find(c => c.stockRef === 'OF-101')!
const spec = { ...of101.spec, payloadKg: 150 }
const defaults = defaultParameters(fenlow45)
const paths = (list: { path: string }[]) => list.map(e => e.path)

describe('POST /api/evaluate', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const client = await signIn('client@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const cars = (await tuner.call('GET', '/api/vehicles?pageSize=100')).body.items as { id: number, stockRef: string, ownerUserId: number | null }[]
  const car101 = cars.find(c => c.stockRef === 'OF-101')!
  const notTheClients = cars.find(c => c.ownerUserId === null)!
  const settings = (await tuner.call('GET', '/api/workshop')).body.settings

  it('evaluates a stored car with the drive unit defaults: valid, figures and curves', async () => {
    const res = await tuner.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'fenlow-45', parameters: defaults })
    expect(res.status).toBe(200)
    expect(res.body.valid).toBe(true)
    expect(res.body.errors).toEqual([])
    const f = res.body.figures
    expect(f.testMassKg).toBe(905 + 150) // the seeded kerb mass plus the default 150 kg payload (docs/computation.md#car-facts)
    // Rear-axle-only braking limit a = μ·g·s_r/(1 + μ·h/L), Gillespie ch. 2 load transfer (REFERENCES.md)
    const mu = settings.friction.wet
    const expected = mu * STANDARD_GRAVITY * 0.53 / (1 + mu * 0.47 / 2.235)
    expect(f.regenGripLimitMs2.wet).toBeCloseTo(expected, 6)
    expect(f.zeroTo50S).toBeGreaterThan(0)
    expect(f.topSpeedKph).toBeGreaterThan(50)
    const s = res.body.curves.speed
    expect(s.speedKph.length).toBeGreaterThan(10)
    for (const k of ['wheelForceN', 'powerKw', 'roadLoadN', 'liftOffRegenForceN']) expect(s[k]).toHaveLength(s.speedKph.length)
    expect(res.body.curves.temperature.motorTorquePct[0]).toBe(100)
  })

  it('evaluates a spec as typed, without a stored car', async () => {
    const res = await tuner.call('POST', '/api/evaluate', { spec, platformKey: 'fenlow-45', parameters: defaults })
    expect(res.status).toBe(200)
    expect(res.body.figures.testMassKg).toBe(1055)
  })

  it('answers a spec that fails its schema with 400 naming each field', async () => {
    const res = await tuner.call('POST', '/api/evaluate', { spec: { ...spec, kerbMassKg: -1, tyreSize: 'big ones', drivenAxle: 'middle' }, platformKey: 'fenlow-45', parameters: defaults })
    expect(res.status).toBe(400)
    expect(paths(res.body.data.fields).sort()).toEqual(['spec.drivenAxle', 'spec.kerbMassKg', 'spec.tyreSize'])
  })

  it('reports an out-of-range setting in errors with its path, and still gives the figures', async () => {
    const res = await tuner.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'fenlow-45', parameters: { ...defaults, powerCapKw: 400 } })
    expect(res.status).toBe(200)
    expect(res.body.valid).toBe(false)
    expect(paths(res.body.errors)).toEqual(['parameters.powerCapKw'])
    expect(res.body.errors[0].message).toMatch(/45 kW/) // the Fenlow 45's maximum
    expect(res.body.figures.zeroTo50S).toBeGreaterThan(0)
  })

  it('reports an inverted derate band, a missing and a non-numeric setting; refuses an unknown one outright', async () => {
    const { batteryChargeLimitA: _gone, ...missingOne } = defaults
    const res = await tuner.call('POST', '/api/evaluate', {
      vehicleId: car101.id, platformKey: 'fenlow-45',
      parameters: { ...missingOne, motorDerateStartC: 150, motorCutoffC: 140, creepTorqueNm: 'lots' }
    })
    expect(res.status).toBe(200)
    expect(res.body.valid).toBe(false)
    const p = paths(res.body.errors)
    for (const path of ['parameters.motorDerateStartC', 'parameters.batteryChargeLimitA', 'parameters.creepTorqueNm']) expect(p).toContain(path)
    const unknown = await tuner.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'fenlow-45', parameters: { ...defaults, boostMode: 1 } })
    expect(unknown.status).toBe(400)
    expect(paths(unknown.body.data.fields)).toEqual(['parameters.boostMode'])
    expect(res.body.errors.find((e: { path: string }) => e.path === 'parameters.motorDerateStartC').message).toMatch(/below/)
    expect(new Set(p).size).toBe(p.length) // ajv's findings are not reported twice
    expect(res.body.figures.testMassKg).toBe(1055)
  })

  it('reports a tyre size it cannot read against the tyre field, and gives the figures it can', async () => {
    // "X" is no speed symbol of the ISO 4000-1 / ETRTO table
    const res = await tuner.call('POST', '/api/evaluate', { spec: { ...spec, tyreSize: '155/80 R13 79X' }, platformKey: 'fenlow-45', parameters: defaults })
    expect(res.status).toBe(200)
    expect(paths(res.body.errors)).toEqual(['spec.tyreSize'])
    expect(res.body.figures.tyreDiameterMm).toBeNull()
    expect(res.body.nullReasons.tyreDiameterMm).toMatch(/tyre/)
    expect(res.body.figures.testMassKg).toBe(1055)
    expect(res.body.figures.chargeTime10to80H).toBeGreaterThan(0)
  })

  it('refuses an unknown drive unit with 400 naming platformKey', async () => {
    const res = await tuner.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'warp-9000', parameters: defaults })
    expect(res.status).toBe(400)
    expect(paths(res.body.data.fields)).toEqual(['platformKey'])
  })

  it('keeps cars to their workshop and owners to their own cars', async () => {
    expect((await otherAdmin.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'fenlow-45', parameters: defaults })).status).toBe(404)
    expect((await tuner.call('POST', '/api/evaluate', { vehicleId: 2147483647, platformKey: 'fenlow-45', parameters: defaults })).status).toBe(404)
    expect((await client.call('POST', '/api/evaluate', { vehicleId: car101.id, platformKey: 'fenlow-45', parameters: defaults })).status).toBe(200)
    expect((await client.call('POST', '/api/evaluate', { vehicleId: notTheClients.id, platformKey: 'fenlow-45', parameters: defaults })).status).toBe(404)
    expect((await anonymous.call('POST', '/api/evaluate', { spec, platformKey: 'fenlow-45', parameters: defaults })).status).toBe(401)
  })

  it('wants a car or a spec, exactly one', async () => {
    const both = await tuner.call('POST', '/api/evaluate', { vehicleId: car101.id, spec, platformKey: 'fenlow-45', parameters: defaults })
    expect(both.status).toBe(400)
    expect(paths(both.body.data.fields)).toContain('vehicleId')
    const neither = await tuner.call('POST', '/api/evaluate', { platformKey: 'fenlow-45', parameters: defaults })
    expect(neither.status).toBe(400)
  })

  it('never answers 5xx, whatever the body', async () => {
    const bodies: unknown[] = [
      '', 'null', '[]', '"text"', '{', '{"a":', 42, { platformKey: 5 }, { vehicleId: -1, platformKey: 'fenlow-45', parameters: {} },
      { vehicleId: 1e300, platformKey: 'fenlow-45', parameters: {} }, { vehicleId: 'x', platformKey: 'fenlow-45', parameters: {} },
      { spec, platformKey: 'fenlow-45', parameters: [] }, { spec, platformKey: 'fenlow-45', parameters: null },
      { spec, platformKey: 'fenlow-45', parameters: { powerCapKw: 1e308, torqueCapNm: -1e308, liftOffRegenPct: '1e999' } },
      { spec, platformKey: 'fenlow-45', parameters: { __proto__: { powerCapKw: 1 }, constructor: 1, toString: {} } },
      { spec, platformKey: 'fenlow-45', parameters: Object.fromEntries(Object.keys(defaults).map(k => [k, [1, 2]])) },
      { spec, platformKey: 'fenlow-45', parameters: Object.fromEntries(Object.keys(defaults).map(k => [k, 0])) },
      { spec, platformKey: 'x'.repeat(5000), parameters: defaults }, { spec: [], platformKey: 'fenlow-45', parameters: defaults },
      { spec: { ...spec, tyreSizeFront: '145/80 R12 74Q', tyreSizeRear: '999/99 R99 999Y' }, platformKey: 'fenlow-45', parameters: defaults },
      { spec: { ...spec, extra: true }, platformKey: 'fenlow-45', parameters: defaults }
    ]
    for (const body of bodies) {
      const res = await tuner.call('POST', '/api/evaluate', body)
      expect(res.status, JSON.stringify(body).slice(0, 200)).toBeLessThan(500)
      expect([200, 400, 404, 413, 415]).toContain(res.status)
    }
    // Any JSON at all as the settings, or as the whole body (fast-check): a 200 or a 400, never a crash. Settings
    // that are all the drive unit's own, each a plain value, are evaluated; another name or a nested value is refused.
    await fc.assert(fc.asyncProperty(
      fc.dictionary(fc.constantFrom(...Object.keys(defaults), 'other'), fc.jsonValue({ maxDepth: 2 })), fc.jsonValue({ maxDepth: 3 }),
      async (parameters, anyBody) => {
        const a = await tuner.call('POST', '/api/evaluate', { spec, platformKey: 'fenlow-45', parameters })
        // A "__proto__" key anywhere is refused whole (prototype pollution); anything else is evaluated.
        if (/"__proto__":/.test(JSON.stringify(parameters))) {
          expect(a.status).toBe(400)
          expect(a.body.message).toMatch(/JSON/)
        } else if (Object.entries(parameters).every(([k, v]) => k !== 'other' && (v === null || typeof v !== 'object'))) {
          expect(a.status).toBe(200)
          expect(Array.isArray(a.body.errors)).toBe(true)
        } else {
          expect(a.status).toBe(400)
          expect(a.body.data.fields[0].path).toMatch(/^parameters\./)
        }
        const b = await tuner.call('POST', '/api/evaluate', JSON.stringify(anyBody))
        expect(b.status).toBeLessThan(500)
      }), { numRuns: 40 })
  })
})
