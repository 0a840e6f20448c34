import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, withDatabase } from './helpers'
import { defaultParameters, fenlow45 } from '../../shared/platforms'
import { STANDARD_GRAVITY } from '../../shared/compute/units'
import { demoCars } from '../../seeders/demo-cars'

const spec = demoCars[0]!.spec // rear-driven, 47 % on the front axle, CG 470 mm, wheelbase 2235 mm

describe('workshop settings', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const original = (await admin.call('GET', '/api/workshop')).body.settings

  it('gives the workshop with every setting filled in from the defaults', async () => {
    const res = await tuner.call('GET', '/api/workshop')
    expect(res.status).toBe(200)
    expect(res.body.name).toBe('Old Forge Electric Works')
    // Defaults within the handbook ranges: wet asphalt 0.50 (Noon 1994), snow 0.20-0.25 (Noon 1994)
    expect(res.body.settings.friction.wet).toBeGreaterThanOrEqual(0.45)
    expect(res.body.settings.friction.wet).toBeLessThanOrEqual(0.65)
    expect(res.body.settings.friction.snow).toBeGreaterThanOrEqual(0.1)
    expect(res.body.settings.friction.snow).toBeLessThanOrEqual(0.25)
    expect(res.body.settings.units).toEqual({ power: 'kW+hp', speed: 'km/h' })
    expect((await anonymous.call('GET', '/api/workshop')).status).toBe(401)
  })

  it('lets the admin change some settings, keeps the rest, records the JSON Patch and uses them at once', async () => {
    const res = await admin.call('PATCH', '/api/workshop/settings', { friction: { wet: 0.42 }, units: { speed: 'mph' } })
    try {
      expect(res.status).toBe(200)
      expect(res.body.settings.friction).toEqual({ ...original.friction, wet: 0.42 })
      expect(res.body.settings.units.speed).toBe('mph')
      expect(res.body.settings.minStartGradePct).toBe(original.minStartGradePct)
      const events = await withDatabase(c => c.query(`SELECT data FROM audit_events WHERE action = $1 AND "workshopId" = (SELECT "workshopId" FROM users WHERE email = $2) ORDER BY id DESC LIMIT 1`, ['workshop.settings-changed', 'admin@voltwright.test']))
      expect(events.rows[0].data.patch).toEqual(expect.arrayContaining([
        { op: 'replace', path: '/friction/wet', value: 0.42 },
        { op: 'replace', path: '/units/speed', value: 'mph' }
      ]))
      expect(events.rows[0].data.before).toEqual(original)
      // The workshop's history shows each change as before → after, even for its first settings change.
      const history = await admin.call('GET', '/api/audit/events?action=workshop.settings-changed&limit=1')
      expect(history.body.items[0].actor.name).toBe('Imogen Rook')
      expect(history.body.items[0].changes).toEqual(expect.arrayContaining([
        { path: '/friction/wet', op: 'replace', before: original.friction.wet, after: 0.42, beforeKnown: true },
        { path: '/units/speed', op: 'replace', before: original.units.speed, after: 'mph', beforeKnown: true }
      ]))
      const evaluated = await tuner.call('POST', '/api/evaluate', { spec, platformKey: 'fenlow-45', parameters: defaultParameters(fenlow45) })
      // Rear-axle-only braking limit a = μ·g·s_r/(1 + μ·h/L) (Gillespie ch. 2, REFERENCES.md) with the new μ
      expect(evaluated.body.figures.regenGripLimitMs2.wet).toBeCloseTo(0.42 * STANDARD_GRAVITY * 0.53 / (1 + 0.42 * 0.47 / 2.235), 6)
      expect((await otherAdmin.call('GET', '/api/workshop')).body.settings.friction.wet).toBe(0.5)
    } finally {
      expect((await admin.call('PATCH', '/api/workshop/settings', original)).body.settings).toEqual(original)
    }
  })

  it('refuses out-of-range, inconsistent and unknown settings, naming each, and changes nothing', async () => {
    const before = (await admin.call('GET', '/api/workshop')).body.settings
    const range = await admin.call('PATCH', '/api/workshop/settings', { friction: { snow: 0.01 }, minStartGradePct: -5 })
    expect(range.status).toBe(400)
    expect(range.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['friction.snow', 'minStartGradePct'])
    // Each message names the setting and its range, as the admin's form shows it beside the field.
    expect(range.body.data.fields).toEqual(expect.arrayContaining([
      { path: 'friction.snow', message: 'Snow friction must be from 0.05 to 0.5' },
      { path: 'minStartGradePct', message: 'Minimum hill-start gradient must be from 0 to 60 %' }
    ]))
    const share = await admin.call('PATCH', '/api/workshop/settings', { tyreLoadCautionFraction: 1, regenGripCautionFraction: null })
    expect(share.body.data.fields).toEqual(expect.arrayContaining([
      { path: 'tyreLoadCautionFraction', message: 'Tyre load caution share must be above 0 % and below 100 % (a fraction between 0 and 1)' },
      { path: 'regenGripCautionFraction', message: 'Regen grip caution share needs a number' }
    ]))
    const order = await admin.call('PATCH', '/api/workshop/settings', { friction: { dry: 0.4, wet: 0.6 } })
    expect(order.status).toBe(400)
    expect(order.body.data.fields[0].path).toBe('friction')
    const unknown = await admin.call('PATCH', '/api/workshop/settings', { friction: { icy: 0.1 }, colour: 'red' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['colour', 'friction.icy'])
    expect((await admin.call('PATCH', '/api/workshop/settings', '[1, 2]')).status).toBe(400)
    expect((await admin.call('GET', '/api/workshop')).body.settings).toEqual(before)
  })

  it('lets only an admin change them', async () => {
    expect((await tuner.call('PATCH', '/api/workshop/settings', { minStartGradePct: 10 })).status).toBe(403)
    expect((await anonymous.call('PATCH', '/api/workshop/settings', { minStartGradePct: 10 })).status).toBe(401)
  })
})
