// Uploaded drive-unit schemas carry no regular expression, and no body makes evaluate run ajv on
// settings the drive unit does not have (docs/security.md).
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase, unique } from './helpers'
import { defaultParameters, fenlow45 } from '../../shared/platforms'
import { addOnCarProfile, newCar } from './fixtures'

const defaults = defaultParameters(fenlow45)
const CATASTROPHIC = '^(a+)+$' // nested quantifiers: exponential backtracking on "aaaa…b"

function hostileSchema() {
  const s = structuredClone(fenlow45.schema) as unknown as Record<string, any>
  s.propertyNames = { pattern: CATASTROPHIC }
  s.patternProperties = { [CATASTROPHIC]: { type: 'number' } }
  s.properties.powerCapKw.pattern = CATASTROPHIC
  s.properties.torqueCapNm.format = 'regex'
  s.properties.creepTorqueNm.$ref = 'https://elsewhere.test/unit.json'
  return s
}

describe('drive-unit schemas and evaluate under hostile input', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const car = await newCar(tuner)

  it('refuses an upload with regular expressions or outside references, listing each keyword with its JSON pointer, and stores nothing', async () => {
    const key = unique('hostile').toLowerCase()
    const res = await admin.call('POST', '/api/platforms', { key, name: 'Hostile 1', motorMaxRpm: 10000, schema: hostileSchema() })
    expect(res.status).toBe(400)
    expect(res.body.data.refused.map((r: { pointer: string, keyword: string }) => `${r.pointer} ${r.keyword}`)).toEqual([
      '/patternProperties patternProperties',
      '/properties/creepTorqueNm/$ref $ref',
      '/properties/powerCapKw/pattern pattern',
      '/properties/torqueCapNm/format format',
      '/propertyNames propertyNames'
    ])
    expect(await withDatabase(async c => (await c.query('SELECT count(*)::int AS n FROM platforms WHERE key = $1', [key])).rows[0].n)).toBe(0)
  })

  it('refuses settings the drive unit does not have before anything checks them, naming each', async () => {
    const longName = `${'a'.repeat(99)}b` // what the catastrophic pattern above would take hours over
    const res = await tuner.call('POST', '/api/evaluate', { vehicleId: car.id, platformKey: 'fenlow-45', parameters: { ...defaults, [longName]: 1, boostKw: 20 } })
    expect(res.status).toBe(400)
    expect(res.body.data.unknown.sort()).toEqual([longName.slice(0, 60), 'boostKw'].sort())
    expect(res.body.data.fields.map((f: { path: string }) => f.path)).toContain('parameters.boostKw')
  })

  it('refuses a stored schema from before the allow-list without compiling it, and an unknown setting on it with 400', async () => {
    const key = unique('legacy').toLowerCase()
    const { workshopId } = await withDatabase(async c => (await c.query('SELECT "workshopId" FROM users WHERE email = $1', ['admin@voltwright.test'])).rows[0])
    await withDatabase(c => c.query('INSERT INTO platforms ("workshopId", key, name, "motorMaxRpm", schema, "createdAt", "updatedAt") VALUES ($1, $2, $3, 10000, $4, now(), now())',
      [workshopId, key, 'Legacy 1', JSON.stringify(hostileSchema())]))
    const spec = (await tuner.call('GET', `/api/vehicles/${car.id}`)).body.spec
    const hostile = await tuner.call('POST', '/api/evaluate', { spec, platformKey: key, parameters: { ...defaults, [`${'a'.repeat(99)}b`]: 1 } })
    expect(hostile.status).toBe(400)
    const plain = await tuner.call('POST', '/api/evaluate', { spec, platformKey: key, parameters: defaults })
    expect(plain.status).toBe(200)
    expect(plain.body.valid).toBe(false)
    expect(plain.body.errors.map((e: { path: string }) => e.path)).toContain('platform.schema')
  })

  it('refuses 10,000 settings, a deeply nested value and an oversized body with 400 or 413, before validating', async () => {
    const many: Record<string, number> = {}
    for (let i = 0; i < 10_000; i++) many[`s${i}`] = 0
    const tenThousand = await tuner.call('POST', '/api/evaluate', { vehicleId: car.id, platformKey: 'fenlow-45', parameters: many })
    expect(tenThousand.status).toBe(413)
    const fewerKeys: Record<string, number> = {}
    for (let i = 0; i < 400; i++) fewerKeys[`s${i}`] = 0
    const fourHundred = await tuner.call('POST', '/api/evaluate', { vehicleId: car.id, platformKey: 'fenlow-45', parameters: fewerKeys })
    expect(fourHundred.status).toBe(400)
    expect(fourHundred.body.message).toMatch(/more than 300 values/)
    const deep = `{"vehicleId":${car.id},"platformKey":"fenlow-45","parameters":{"powerCapKw":${'['.repeat(5000)}${']'.repeat(5000)}}}`
    const nested = await tuner.call('POST', '/api/evaluate', deep)
    expect(nested.status).toBe(400)
    expect(nested.body.message).toMatch(/body nests deeper than 5 levels/)
    const shallowObject = await tuner.call('POST', '/api/evaluate', { vehicleId: car.id, platformKey: 'fenlow-45', parameters: { ...defaults, powerCapKw: { a: 1 } } })
    expect(shallowObject.status).toBe(400)
    expect(shallowObject.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['parameters.powerCapKw'])
  })

  it('refuses a setting the drive unit does not have in a new version and an edit (read-backs: drift.test.ts)', async () => {
    const profile = await tuner.call('POST', `/api/vehicles/${car.id}/profiles`, { name: unique('P').slice(0, 30), parameters: defaults })
    expect(profile.status).toBe(201)
    const created = await tuner.call('POST', `/api/profiles/${profile.body.profile.id}/versions`, { parameters: { ...defaults, boostKw: 20 } })
    expect(created.status).toBe(400)
    const edited = await tuner.call('PATCH', `/api/versions/${profile.body.id}`, { lockVersion: profile.body.lockVersion, parameters: { ...defaults, boostKw: 20 } })
    expect(edited.status).toBe(400)
    expect(JSON.stringify(edited.body.data.fields)).toMatch(/boostKw/)
  })

  it('still reads a version stored with a setting the drive unit does not have, and reports it as an error', async () => {
    const { versionId } = await addOnCarProfile(car.id, { name: unique('Old').slice(0, 30), parameters: { ...defaults, boostKw: 20 } })
    const res = await tuner.call('GET', `/api/versions/${versionId}`)
    expect(res.status).toBe(200)
    expect(res.body.liveEvaluation.valid).toBe(false)
    expect(res.body.liveEvaluation.errors.map((e: { path: string }) => e.path)).toContain('parameters.boostKw')
  })
})
