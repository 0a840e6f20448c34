import Ajv2020 from 'ajv/dist/2020'
import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { offStep } from '../../shared/compute/parameter-input'
import { PARAMETER_NAMES } from '../../shared/compute/parameters'
import type { ParameterProperty } from '../../shared/compute/types'
import { roleSettings } from '../../shared/compute/roles'
import { settingKind } from '../../shared/compute/setting-kinds'
import { corvath130, defaultParameters, findPlatform, firstPlatforms, peltry70, platforms, quennel95 } from '../../shared/platforms/index'

describe.each(firstPlatforms.map(p => [p.key, p] as const))('platform %s', (_key, platform) => {
  it('validates against the JSON Schema 2020-12 meta-schema (json-schema.org, draft 2020-12)', () => {
    // A plain Ajv2020 with no Voltwright additions: the meta-schema alone decides.
    const ajv = new Ajv2020({ strict: false })
    expect(platform.schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema')
    expect(ajv.validateSchema(platform.schema), JSON.stringify(ajv.errors)).toBe(true)
  })

  it('requires all eighteen parameters, each a number with range, step, default, unit, title, description and role', () => {
    expect(Object.keys(roleSettings(platform.schema))).toHaveLength(18)
    expect([...platform.schema.required].sort()).toEqual([...PARAMETER_NAMES].sort())
    expect(Object.keys(platform.schema.properties).sort()).toEqual([...PARAMETER_NAMES].sort())
    for (const name of PARAMETER_NAMES) {
      const p = platform.schema.properties[name]! as ParameterProperty
      expect(p.type).toBe('number')
      expect(p.minimum).toBeLessThan(p.maximum)
      expect(p.default).toBeGreaterThanOrEqual(p.minimum)
      expect(p.default).toBeLessThanOrEqual(p.maximum)
      expect(offStep(p.default, p.multipleOf), `${name} default on its step`).toBe(false)
      expect(p.multipleOf).toBeGreaterThan(0)
      expect(p.unit.length).toBeGreaterThan(0)
      expect(p.title.length).toBeGreaterThan(0)
      expect(p.description).not.toMatch(/\n/)
    }
  })

  it('states the derate ordering that JSON Schema cannot express, and keeps its defaults in that order', () => {
    expect(platform.schema.description).toMatch(/derate start .* must be below its cut-off/)
    const d = defaultParameters(platform)
    expect(d.motorDerateStartC).toBeLessThan(d.motorCutoffC)
    expect(d.inverterDerateStartC).toBeLessThan(d.inverterCutoffC)
    expect(d.batteryDerateStartC).toBeLessThan(d.batteryCutoffC)
  })

  it('its defaults evaluate without errors on the example car', () => {
    const e = evaluate(exampleSpec, platform, defaultParameters(platform))
    expect(e.errors).toEqual([])
    expect(e.valid).toBe(true)
  })
})

describe.each(platforms.map(p => [p.key, p] as const))('drive unit %s', (_key, platform) => {
  it('validates against the JSON Schema 2020-12 meta-schema, every setting of a kind the form can show', () => {
    expect(new Ajv2020({ strict: false }).validateSchema(platform.schema)).toBe(true)
    for (const [name, p] of Object.entries(platform.schema.properties)) expect(settingKind(p as unknown as Record<string, unknown>), name).toBeDefined()
  })

  it('its defaults evaluate without errors on the example car', () => {
    expect(evaluate(exampleSpec, platform, defaultParameters(platform)).errors).toEqual([])
  })
})

describe('the three controllers with settings of their own', () => {
  it('one caps motor current in A, with a torque constant', () => {
    expect(corvath130.torqueConstantNmPerA).toBeGreaterThan(0)
    const s = roleSettings(corvath130.schema)
    expect((corvath130.schema.properties[s.torqueCap!] as ParameterProperty).unit).toBe('A')
  })

  it('one gives regen as a 0-1 fraction, power in hp and speed in mph', () => {
    const unitOf = (role: 'liftOffRegen' | 'powerCap' | 'speedLimit') => (peltry70.schema.properties[roleSettings(peltry70.schema)[role]!] as ParameterProperty).unit
    expect([unitOf('liftOffRegen'), unitOf('powerCap'), unitOf('speedLimit')]).toEqual(['fraction', 'hp', 'mph'])
  })

  it('one has no creep, but a hill-hold switch, drive modes and a throttle map that never falls', () => {
    expect(roleSettings(quennel95.schema).creepTorque).toBeUndefined()
    const kinds = Object.values(quennel95.schema.properties).map(p => settingKind(p as unknown as Record<string, unknown>))
    expect(kinds).toEqual(expect.arrayContaining(['boolean', 'enumeration', 'curve']))
    expect(quennel95.schema.properties.throttleMap).toMatchObject({ 'x-monotonic': true })
  })
})

describe('the platform list', () => {
  it('has three families of rising size with unique keys', () => {
    expect(new Set(platforms.map(p => p.key)).size).toBe(6)
    const peaks = firstPlatforms.map(p => (p.schema.properties.powerCapKw as ParameterProperty).maximum)
    expect([...peaks].sort((a, b) => a - b)).toEqual(peaks)
    expect(peaks[0]).toBeLessThan(peaks[2]!)
    expect(findPlatform('marrick-110')?.name).toBe('Marrick 110')
    expect(findPlatform('nope')).toBeUndefined()
  })

  it('defaultParameters gives every parameter its schema default', () => {
    const p = platforms[0]!
    const d = defaultParameters(p)
    expect(Object.keys(d).sort()).toEqual([...PARAMETER_NAMES].sort())
    for (const name of PARAMETER_NAMES) expect(d[name]).toBe(p.schema.properties[name]!.default)
    expect(defaultParameters(quennel95).throttleMap).toEqual(quennel95.schema.properties.throttleMap!.default)
  })
})
