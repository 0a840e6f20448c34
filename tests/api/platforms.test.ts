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
    expect(problems.some(p => p.includes('properties.powerCapKw.minimum'))).toBe(true)
    expect(await stored(key)).toBe(0)
  })

  it('refuses a schema that lacks what Voltwright needs (a setting, a unit, a sane range)', async () => {
    const key = unique('partial').toLowerCase()
    const upload = goodUpload(key)
    const props = upload.schema.properties as unknown as Record<string, Record<string, unknown>>
    delete props.creepSpeedKph
    delete props.powerCapKw!.unit
    props.torqueCapNm!.minimum = 500
    const res = await admin.call('POST', '/api/platforms', upload)
    expect(res.status).toBe(400)
    const problems: string[] = res.body.data.problems
    expect(problems).toContain('properties.creepSpeedKph is missing: every platform needs all 18 parameters')
    expect(problems.some(p => p.includes('powerCapKw.unit'))).toBe(true)
    expect(problems.some(p => p.includes('torqueCapNm: minimum must be below maximum'))).toBe(true)
    expect(await stored(key)).toBe(0)
    const notAnObject = await admin.call('POST', '/api/platforms', { ...goodUpload(key), schema: 'not json schema' })
    expect(notAnObject.status).toBe(400)
    expect(notAnObject.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['schema'])
  })

  it('lets only an admin upload', async () => {
    const key = unique('tuners').toLowerCase()
    expect((await tuner.call('POST', '/api/platforms', goodUpload(key))).status).toBe(403)
    expect((await anonymous.call('POST', '/api/platforms', goodUpload(key))).status).toBe(401)
    expect(await stored(key)).toBe(0)
  })
})
