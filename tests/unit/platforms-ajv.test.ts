import { describe, expect, it } from 'vitest'
import { cachedValidatorCount, compileParameterValidator, createAjv, MAX_VALIDATORS, validatePlatform, validatePlatformSchema } from '../../shared/platforms/ajv'
import { defaultParameters, marrick110, fenlow45, platforms } from '../../shared/platforms/index'

const clone = <T>(x: T): T => structuredClone(x)

describe('validatePlatformSchema', () => {
  it.each(platforms.map(p => [p.key, p] as const))('accepts the %s schema', (_key, p) => {
    expect(validatePlatformSchema(p.schema, { torqueConstantNmPerA: p.torqueConstantNmPerA })).toEqual({ ok: true, errors: [] })
  })

  it('accepts a unit without a setting the physics knows, and names a setting left out of required', () => {
    const s = clone(fenlow45.schema)
    delete (s.properties as Record<string, unknown>).creepTorqueNm
    s.required = s.required.filter(n => n !== 'creepTorqueNm' && n !== 'creepSpeedKph')
    expect(validatePlatformSchema(s).errors).toEqual(['/required: must list every setting (missing creepSpeedKph)'])
    s.required.push('creepSpeedKph')
    expect(validatePlatformSchema(s)).toEqual({ ok: true, errors: [] })
  })

  it('names an unknown role, a repeated role and a unit that does not convert, each with its JSON pointer', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    s.properties.creepTorqueNm!['x-role'] = 'launchControl'
    s.properties.creepSpeedKph!['x-role'] = 'speedLimit'
    s.properties.powerCapKw!.unit = 'km/h'
    s.properties.motorCutoffC!.unit = 'furlongs'
    const r = validatePlatformSchema(s)
    expect(r.errors).toEqual([
      '/properties/powerCapKw/unit: km/h does not convert to power (it is a speed)',
      '/properties/creepTorqueNm/x-role: "launchControl" is not a role Voltwright knows',
      '/properties/speedLimitKph/x-role: the speed limit is already given by /properties/creepSpeedKph',
      '/properties/motorCutoffC/unit: furlongs does not convert to temperature'
    ])
  })

  it('a motor current stands for torque only with the drive unit\'s torque constant', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    s.properties.torqueCapNm = { ...s.properties.torqueCapNm, unit: 'A', maximum: 300, default: 200 }
    expect(validatePlatformSchema(s).errors).toEqual(['/properties/torqueCapNm/unit: a motor current in A needs the drive unit\'s torque constant (N·m per A)'])
    expect(validatePlatformSchema(s, { torqueConstantNmPerA: 0.7 }).ok).toBe(true)
    expect(validatePlatform({ key: 'amps', name: 'Amps', motorMaxRpm: 9000, torqueConstantNmPerA: -1, schema: s }).errors[0]).toMatch(/torqueConstantNmPerA/)
  })

  it('checks switches, choices and curves, and their defaults', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>>, required: string[] }
    s.properties.hillHold = { type: 'boolean', title: 'Hill hold', default: 'yes' }
    s.properties.mode = { 'type': 'string', 'title': 'Mode', 'enum': ['eco'], 'x-enumTitles': ['Eco', 'Sport'], 'default': 'eco' }
    s.properties.map = { 'type': 'array', 'title': 'Map', 'maxItems': 500, 'x-monotonic': true, 'items': { type: 'object', properties: { x: { type: 'number', title: 'Pedal', unit: '%', minimum: 0, maximum: 100 } } }, 'default': [] }
    s.properties.rampMap = { 'type': 'array', 'title': 'Ramp', 'maxItems': 4, 'x-monotonic': true,
      'items': { type: 'object', properties: { x: { type: 'number', title: 'Pedal', unit: '%', minimum: 0, maximum: 100 }, y: { type: 'number', title: 'Torque', unit: '%', minimum: 0, maximum: 100 } }, required: ['x', 'y'], additionalProperties: false },
      'default': [{ x: 0, y: 0 }, { x: 50, y: 60 }, { x: 100, y: 40 }] }
    s.required.push('hillHold', 'mode', 'map', 'rampMap')
    expect(validatePlatformSchema(s).errors).toEqual([
      '/properties/hillHold/default: Hill hold must be on or off',
      '/properties/mode/enum: needs from 2 to 20 choices',
      '/properties/mode/x-enumTitles: must give one label per choice',
      '/properties/map/items: a curve\'s points must be objects with x and y',
      '/properties/map/maxItems: must be from 2 to 64',
      '/properties/rampMap/default: Ramp must never fall: point 3 is below point 2'
    ])
  })

  it('names a missing maximum, unit or default, and a range upside down', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    delete s.properties.powerCapKw!.maximum
    delete s.properties.torqueCapNm!.unit
    delete s.properties.speedLimitKph!.default
    s.properties.batteryCutoffC!.minimum = 90
    const r = validatePlatformSchema(s)
    expect(r.errors).toEqual(expect.arrayContaining([
      '/properties/powerCapKw/maximum: must be a number',
      '/properties/torqueCapNm/unit: must name the unit, e.g. "kW"',
      '/properties/speedLimitKph/default: a default is needed, the value a new profile starts from',
      '/properties/batteryCutoffC: minimum must be below maximum'
    ]))
  })

  it('reports what the 2020-12 meta-schema refuses, with where', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    s.properties.powerCapKw!.minimum = 'five'
    const r = validatePlatformSchema(s)
    expect(r.ok).toBe(false)
    expect(r.errors.some(e => e.startsWith('Not valid JSON Schema 2020-12: /properties/powerCapKw/minimum'))).toBe(true)
  })

  it('refuses the wrong draft, a non-object and a keyword not on the allow-list', () => {
    expect(validatePlatformSchema({ ...fenlow45.schema, $schema: 'http://json-schema.org/draft-07/schema#' }).errors[0]).toMatch(/^\/\$schema: must be/)
    expect(validatePlatformSchema('schema').errors).toEqual(['The schema must be a JSON object'])
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    s.properties.powerCapKw!.colour = 'copper'
    expect(validatePlatformSchema(s).errors).toEqual(['/properties/powerCapKw/colour: "colour" is not among the keywords Voltwright accepts'])
  })

  it('a unit must be a non-empty string', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    s.properties.powerCapKw!.unit = 5
    expect(validatePlatformSchema(s).ok).toBe(false)
  })
})

describe('validatePlatform', () => {
  it('checks key, name and motor speed as well as the schema', () => {
    expect(validatePlatform(marrick110).ok).toBe(true)
    const r = validatePlatform({ ...marrick110, key: 'Marrick 110', name: ' ', motorMaxRpm: 0 })
    expect(r.errors).toHaveLength(3)
  })
})

describe('compileParameterValidator', () => {
  const validate = compileParameterValidator(marrick110)

  it('accepts the defaults and refuses what evaluate refuses', () => {
    const d = defaultParameters(marrick110)
    expect(validate(d)).toBe(true)
    expect(validate({ ...d, powerCapKw: 500 })).toBe(false)
    expect(validate({ ...d, powerCapKw: '80' })).toBe(false)
    expect(validate({ ...d, powerCapKw: 80.3 })).toBe(false) // off its 0.5 kW step
    const { torqueCapNm: _, ...missing } = d
    expect(validate(missing)).toBe(false)
    expect(validate({ ...d, extra: 1 })).toBe(false)
  })

  it('is cached per platform key and schema, and recompiles an edited schema', () => {
    expect(compileParameterValidator(marrick110)).toBe(validate)
    const edited = clone(marrick110)
    edited.schema.properties.powerCapKw!.maximum = 90
    const v2 = compileParameterValidator(edited)
    expect(v2).not.toBe(validate)
    expect(v2({ ...defaultParameters(marrick110), powerCapKw: 100 })).toBe(false)
    expect(validate({ ...defaultParameters(marrick110), powerCapKw: 100 })).toBe(true)
  })

  it('knows the unit keyword in strict mode', () => {
    expect(() => createAjv().compile({ type: 'number', unit: 'kW' })).not.toThrow()
    expect(() => createAjv().compile({ type: 'number', unit: '' })).toThrow()
  })
})

describe('compileParameterValidator', () => {
  it('compiles a schema once, and keeps no more validators than its limit however many schemas come', () => {
    const first = compileParameterValidator(fenlow45)
    expect(compileParameterValidator(fenlow45)).toBe(first)
    // Small schemas, each its own, as a workshop uploading one after another would send.
    for (let i = 0; i < MAX_VALIDATORS + 40; i++) {
      const schema = { type: 'object', properties: { powerCapKw: { type: 'number', maximum: 100 + i } } }
      const validate = compileParameterValidator({ ...fenlow45, key: `uploaded-${i}`, schema: schema as never })!
      expect(validate({ powerCapKw: 100 + i })).toBe(true)
      expect(validate({ powerCapKw: 101 + i })).toBe(false)
    }
    expect(cachedValidatorCount()).toBe(MAX_VALIDATORS)
    // The least recently used was dropped and is compiled afresh when it is needed again.
    expect(compileParameterValidator(fenlow45)).not.toBe(first)
  }, 30_000)
})
