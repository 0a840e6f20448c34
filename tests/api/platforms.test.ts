import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, withDatabase, unique } from './helpers'
import { defaultParameters, fenlow45 } from '../../shared/platforms'
import { demoCars } from '../../seeders/demo-cars'

const spec = demoCars[0]!.spec
const goodUpload = (key: string) => ({ key, name: 'Osprey 60', motorMaxRpm: 11000, schema: structuredClone(fenlow45.schema) })
const stored = (key: string) => withDatabase(async c => (await c.query('SELECT count(*)::int AS n FROM platforms WHERE key = $1', [key])).rows[0].n as number)

describe('drive units', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')

  it('reads one drive unit by key, with its schema; unknown keys are 404; needs a session', async () => {
    const res = await tuner.call('GET', '/api/platforms/marrick-110')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ key: 'marrick-110', name: 'Marrick 110', motorMaxRpm: 12000, shared: true })
    expect(res.body.schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema')
    expect(Object.keys(res.body.schema.properties)).toHaveLength(18)
    expect((await tuner.call('GET', '/api/platforms/no-such-unit')).status).toBe(404)
    expect((await anonymous.call('GET', '/api/platforms/marrick-110')).status).toBe(401)
  })

  it('stores a good schema for the admin\'s workshop, with its audit event, and evaluates with it', async () => {
    const key = unique('osprey').toLowerCase()
    const res = await admin.call('POST', '/api/platforms', goodUpload(key))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ key, name: 'Osprey 60', motorMaxRpm: 11000, shared: false })
    expect((await tuner.call('GET', `/api/platforms/${key}`)).status).toBe(200)
    const list = (await tuner.call('GET', '/api/platforms')).body.items.map((p: { key: string }) => p.key)
    expect(list).toContain(key)
    const events = await withDatabase(c => c.query('SELECT action, data FROM audit_events WHERE "entityType" = $1 AND "entityId" = $2', ['platform', String(res.body.id)]))
    expect(events.rows.map(r => r.action)).toEqual(['platform.created'])
    expect(events.rows[0].data.after.key).toBe(key)
    const evaluated = await tuner.call('POST', '/api/evaluate', { spec, platformKey: key, parameters: defaultParameters(fenlow45) })
    expect(evaluated.status).toBe(200)
    expect(evaluated.body.valid).toBe(true)
    // Another workshop sees neither the unit nor can evaluate with it.
    expect((await otherAdmin.call('GET', `/api/platforms/${key}`)).status).toBe(404)
    expect((await otherAdmin.call('POST', '/api/evaluate', { spec, platformKey: key, parameters: {} })).status).toBe(400)
    expect((await admin.call('POST', '/api/platforms', goodUpload(key))).status).toBe(409)
  })

  it('keeps each workshop\'s keys its own: another workshop may use the same key, a shared key is taken by everyone', async () => {
    const key = unique('kestrel').toLowerCase()
    const theirs = await otherAdmin.call('POST', '/api/platforms', goodUpload(key))
    expect(theirs.status).toBe(201)
    const ours = await admin.call('POST', '/api/platforms', goodUpload(key))
    expect(ours.status).toBe(201) // not a 409 that would tell us the other workshop has it
    expect(ours.body.id).not.toBe(theirs.body.id)
    expect((await tuner.call('GET', `/api/platforms/${key}`)).body.id).toBe(ours.body.id)
    expect((await otherAdmin.call('GET', `/api/platforms/${key}`)).body.id).toBe(theirs.body.id)
    const twice = await Promise.all([admin.call('POST', '/api/platforms', goodUpload(key)), admin.call('POST', '/api/platforms', goodUpload(key))])
    expect(twice.map(r => r.status)).toEqual([409, 409])
    const shared = await admin.call('POST', '/api/platforms', goodUpload('fenlow-45'))
    expect(shared.status).toBe(409)
    expect(shared.body.data.fields).toEqual([{ path: 'key', message: 'Already used' }])
    // The database holds the rule too: a second unit of one workshop under one key is refused.
    await expect(withDatabase(c => c.query('INSERT INTO platforms ("workshopId", key, name, "motorMaxRpm", schema, "createdAt", "updatedAt") SELECT "workshopId", key, name, "motorMaxRpm", schema, now(), now() FROM platforms WHERE id = $1', [ours.body.id]))).rejects.toThrow(/platforms_workshop_key/)
  })

  it('refuses a schema that breaks the JSON Schema 2020-12 meta-schema, lists the problems and stores nothing', async () => {
    const key = unique('broken').toLowerCase()
    const upload = goodUpload(key)
    // The 2020-12 meta-schema wants "required" as an array of strings and "minimum" as a number (json-schema.org, draft 2020-12).
    Object.assign(upload.schema, { required: 'powerCapKw' })
    ;(upload.schema.properties.powerCapKw as unknown as Record<string, unknown>).minimum = 'ten'
    const res = await admin.call('POST', '/api/platforms', upload)
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/cannot be used/)
    const problems: string[] = res.body.data.problems
    expect(problems.some(p => p.startsWith('Not valid JSON Schema 2020-12'))).toBe(true)
    expect(problems.some(p => p.includes('/properties/powerCapKw/minimum'))).toBe(true)
    expect(await stored(key)).toBe(0)
  })

  it('refuses a schema that lacks what Voltwright needs, every problem with its JSON pointer', async () => {
    const key = unique('partial').toLowerCase()
    const upload = goodUpload(key)
    const props = upload.schema.properties as unknown as Record<string, Record<string, unknown>>
    delete props.creepSpeedKph
    delete props.powerCapKw!.unit
    props.torqueCapNm!.minimum = 500
    props.creepTorqueNm!['x-role'] = 'torqueCap'
    props.batteryCutoffC!['x-role'] = 'warpFactor'
    props.speedLimitKph!.unit = 'kW'
    const res = await admin.call('POST', '/api/platforms', upload)
    expect(res.status).toBe(400)
    const problems: string[] = res.body.data.problems
    expect(problems).toEqual(expect.arrayContaining([
      '/properties/powerCapKw/unit: must name the unit, e.g. "kW"',
      '/properties/torqueCapNm: minimum must be below maximum',
      '/properties/creepTorqueNm/x-role: the torque cap is already given by /properties/torqueCapNm',
      '/properties/speedLimitKph/unit: kW does not convert to speed (it is a power)',
      '/properties/batteryCutoffC/x-role: "warpFactor" is not a role Voltwright knows'
    ]))
    expect(await stored(key)).toBe(0)
    const notAnObject = await admin.call('POST', '/api/platforms', { ...goodUpload(key), schema: 'not json schema' })
    expect(notAnObject.status).toBe(400)
    expect(notAnObject.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['schema'])
  })

  it('stores a unit in hp, amps and fractions with its torque constant, and one without creep, and evaluates both', async () => {
    const key = unique('amps').toLowerCase()
    const upload = { ...goodUpload(key), torqueConstantNmPerA: 0.8 }
    const props = upload.schema.properties as unknown as Record<string, Record<string, unknown>>
    props.torqueCapNm = { ...props.torqueCapNm, unit: 'A', minimum: 20, maximum: 300, default: 175 }
    props.powerCapKw = { ...props.powerCapKw, unit: 'hp', minimum: 10, maximum: 60, default: 53.5 }
    props.liftOffRegenPct = { ...props.liftOffRegenPct, unit: 'fraction', minimum: 0, maximum: 1, multipleOf: 0.01, default: 0.15 }
    const withoutConstant = await admin.call('POST', '/api/platforms', { ...upload, torqueConstantNmPerA: undefined })
    expect(withoutConstant.body.data.problems).toEqual(['/properties/torqueCapNm/unit: a motor current in A needs the drive unit\'s torque constant (N·m per A)'])
    const res = await admin.call('POST', '/api/platforms', upload)
    expect(res.status).toBe(201)
    expect(res.body.torqueConstantNmPerA).toBe(0.8)
    const parameters = Object.fromEntries(Object.entries(props).map(([k, p]) => [k, p.default]))
    const amps = await tuner.call('POST', '/api/evaluate', { spec, platformKey: key, parameters })
    const metric = await tuner.call('POST', '/api/evaluate', { spec, platformKey: 'fenlow-45', parameters: { ...defaultParameters(fenlow45), torqueCapNm: 140, powerCapKw: 53.5 * 0.745699872, liftOffRegenPct: 15 } })
    expect(amps.body.errors).toEqual([])
    // 175 A × 0.8 N·m/A = 140 N·m; 53.5 hp × 745.699872 W (NIST SP 811)
    expect(amps.body.roles.torqueCapNm).toBeCloseTo(140, 9)
    expect(amps.body.figures.maxWheelForceN).toBeCloseTo(metric.body.figures.maxWheelForceN, 6)
    expect(amps.body.figures.zeroTo50S).toBeCloseTo(metric.body.figures.zeroTo50S, 6)

    const noCreep = { ...goodUpload(unique('nocreep').toLowerCase()) }
    const p2 = noCreep.schema.properties as unknown as Record<string, unknown>
    delete p2.creepTorqueNm
    delete p2.creepSpeedKph
    noCreep.schema.required = noCreep.schema.required.filter(n => !n.startsWith('creep'))
    expect((await admin.call('POST', '/api/platforms', noCreep)).status).toBe(201)
    const { creepTorqueNm: _t, creepSpeedKph: _s, ...rest } = defaultParameters(fenlow45)
    const e = await tuner.call('POST', '/api/evaluate', { spec, platformKey: noCreep.key, parameters: rest })
    expect(e.body.valid).toBe(true)
    expect(e.body.figures.creepHoldGradePct).toBeNull()
    expect(e.body.nullReasons.creepHoldGradePct).toBe('This controller has no creep setting')
    expect(e.body.warnings.find((w: { rule: string }) => w.rule === 'creep-hold')).toMatchObject({ severity: 'caution', unchecked: true })
  })

  it('lets only an admin upload', async () => {
    const key = unique('tuners').toLowerCase()
    expect((await tuner.call('POST', '/api/platforms', goodUpload(key))).status).toBe(403)
    expect((await anonymous.call('POST', '/api/platforms', goodUpload(key))).status).toBe(401)
    expect(await stored(key)).toBe(0)
  })
})
