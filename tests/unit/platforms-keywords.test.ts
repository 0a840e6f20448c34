import { describe, expect, it } from 'vitest'
import { compileParameterValidator, validatePlatform, validatePlatformSchema } from '../../shared/platforms/ajv'
import { refusedKeywords, SCHEMA_KEYWORDS, unknownSettings } from '../../shared/platforms/keywords'
import { fenlow45, platforms } from '../../shared/platforms/index'

const hostile = () => {
  const s = structuredClone(fenlow45.schema) as unknown as Record<string, any>
  s.patternProperties = { '^(a+)+$': { type: 'number' } }
  s.propertyNames = { pattern: '^(a+)+$' }
  s.properties.powerCapKw.pattern = '^(a+)+$'
  s.properties['a/b~c'] = { type: 'string', format: 'regex' }
  s.properties.creepTorqueNm.$ref = 'https://elsewhere.test/schema.json'
  s.$defs = { x: { type: 'number' } }
  return s
}

describe('the keyword allow-list of drive-unit schemas', () => {
  it.each(platforms.map(p => [p.key, p] as const))('accepts every keyword the %s schema uses', (_key, p) => {
    expect(refusedKeywords(p.schema)).toEqual([])
  })

  it('is one list with no regular-expression or reference keyword on it', () => {
    for (const k of ['pattern', 'patternProperties', 'propertyNames', 'format', '$ref', '$dynamicRef', '$defs', 'if', 'allOf']) expect(Object.hasOwn(SCHEMA_KEYWORDS, k)).toBe(false)
  })

  it('lists every refused keyword with its JSON pointer (RFC 6901: "/" as ~1, "~" as ~0)', () => {
    const refused = refusedKeywords(hostile())
    expect(refused.map(r => [r.pointer, r.keyword])).toEqual([
      ['/$defs', '$defs'],
      ['/patternProperties', 'patternProperties'],
      ['/properties/a~1b~0c', 'properties'],
      ['/properties/creepTorqueNm/$ref', '$ref'],
      ['/properties/powerCapKw/pattern', 'pattern'],
      ['/propertyNames', 'propertyNames']
    ])
  })

  it('finds format under a setting with a plain name, and $schema or $id below the top', () => {
    const s = structuredClone(fenlow45.schema) as unknown as Record<string, any>
    s.properties.note = { type: 'string', format: 'regex', $id: 'x', $schema: 'y' }
    expect(refusedKeywords(s).map(r => r.pointer)).toEqual(['/properties/note/$id', '/properties/note/$schema', '/properties/note/format'])
  })

  it('refuses a schema nested past the limit without walking it all, and without running the meta-schema', () => {
    let deep: Record<string, unknown> = { type: 'number' }
    for (let i = 0; i < 100_000; i++) deep = { type: 'object', additionalProperties: deep }
    const check = validatePlatformSchema({ ...fenlow45.schema, additionalProperties: deep })
    expect(check.ok).toBe(false)
    expect(check.refused!.length).toBe(1)
    expect(check.errors[0]).toMatch(/at most 500 subschemas, 6 deep/)
    expect(check.errors.some(e => e.startsWith('Not valid JSON Schema'))).toBe(false)
  })

  it('answers an upload with every refusal, and nothing from ajv', () => {
    const check = validatePlatform({ key: 'osprey-60', name: 'Osprey 60', motorMaxRpm: 11000, schema: hostile() })
    expect(check.ok).toBe(false)
    expect(check.refused).toHaveLength(6)
    expect(check.errors).toContain('/properties/powerCapKw/pattern: "pattern" is not among the keywords Voltwright accepts')
  })

  it('compiles no validator for a stored schema the list now refuses', () => {
    expect(compileParameterValidator({ ...fenlow45, key: 'stored-before', schema: hostile() })).toBeNull()
    expect(compileParameterValidator(fenlow45)).not.toBeNull()
  })
})

describe('unknownSettings', () => {
  it('names the settings a schema does not define, own properties only', () => {
    expect(unknownSettings(fenlow45.schema, ['powerCapKw', 'boostKw', 'constructor', '__proto__'])).toEqual(['boostKw', 'constructor', '__proto__'])
    expect(unknownSettings(null, ['powerCapKw'])).toEqual(['powerCapKw'])
  })
})
