import { describe, expect, it } from 'vitest'
import { compileParameterValidator, createAjv, validatePlatform, validatePlatformSchema } from '../../shared/platforms/ajv'
import { defaultParameters, marrick110, fenlow45, platforms } from '../../shared/platforms/index'

const clone = <T>(x: T): T => structuredClone(x)

describe('validatePlatformSchema', () => {
  it.each(platforms.map(p => [p.key, p] as const))('accepts the %s schema', (_key, p) => {
    expect(validatePlatformSchema(p.schema)).toEqual({ ok: true, errors: [] })
  })

  it('names a missing parameter', () => {
    const s = clone(fenlow45.schema)
    delete (s.properties as Record<string, unknown>).creepTorqueNm
    s.required = s.required.filter(n => n !== 'creepTorqueNm')
    const r = validatePlatformSchema(s)
    expect(r.ok).toBe(false)
    expect(r.errors).toContain('properties.creepTorqueNm is missing: every platform needs all 18 parameters')
  })

  it('names a missing maximum, unit or default, and a range upside down', () => {
    const s = clone(fenlow45.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    delete s.properties.powerCapKw!.maximum
    delete s.properties.torqueCapNm!.unit
    delete s.properties.speedLimitKph!.default
    s.properties.batteryCutoffC!.minimum = 90
    const r = validatePlatformSchema(s)
    expect(r.errors).toEqual(expect.arrayContaining([
      'properties.powerCapKw.maximum must be a number',
      'properties.torqueCapNm.unit must name the unit, e.g. "kW"',
      'properties.speedLimitKph.default must be a number',
      'properties.batteryCutoffC: minimum must be below maximum'
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
    expect(validatePlatformSchema({ ...fenlow45.schema, $schema: 'http://json-schema.org/draft-07/schema#' }).errors[0]).toMatch(/\$schema must be/)
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
