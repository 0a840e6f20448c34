// Server-side JSON Schema tools for platform schemas (ajv compiles code, so not for the browser).
import Ajv2020, { type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js'
import { PARAMETER_NAMES } from '../compute/parameters'
import type { PlatformLike } from '../compute/types'
import { JSON_SCHEMA_2020_12 } from './define'
import { describeRefusal, refusedKeywords, type RefusedKeyword } from './keywords'

// Strict mode rejects unknown keywords, so Voltwright's `unit` is declared as one.
export function createAjv(): Ajv2020 {
  const ajv = new Ajv2020({ strict: true, allErrors: true, multipleOfPrecision: 9 })
  ajv.addKeyword({ keyword: 'unit', schemaType: 'string', metaSchema: { type: 'string', minLength: 1 } })
  return ajv
}

let shared: Ajv2020 | null = null
const ajv = (): Ajv2020 => (shared ??= createAjv())
const validators = new Map<string, ValidateFunction>()

// FNV-1a over the schema's JSON: cheap, and enough to notice an edited schema under the same key.
function hash(text: string): string {
  let h = 0x811c9dc5
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193)
  return (h >>> 0).toString(16)
}

// A validator for a platform's parameters, compiled once per platform key and schema; none for a schema
// stored before the keyword allow-list that it now refuses (ajv never compiles a user's regular expression).
export function compileParameterValidator(platform: PlatformLike): ValidateFunction | null {
  if (refusedKeywords(platform.schema).length) return null
  const key = `${platform.key}:${hash(JSON.stringify(platform.schema))}`
  let validate = validators.get(key)
  if (!validate) {
    // Without $id, so an edited schema under the same id does not clash with the one compiled before.
    const { $id: _id, ...schema } = platform.schema as Record<string, unknown>
    validate = ajv().compile(schema)
    validators.set(key, validate)
  }
  return validate
}

export function describeAjvErrors(errors: ErrorObject[] | null | undefined): string[] {
  return (errors ?? []).map(e => `${e.instancePath || '(top level)'} ${e.message ?? 'is not valid'}`.trim())
}

export interface SchemaCheck { ok: boolean, errors: string[], refused?: RefusedKeyword[] }

// First the keyword allow-list (./keywords), so nothing else ever sees a refused keyword; then the 2020-12
// meta-schema, then Voltwright's own needs: all 18 parameters, each with minimum, maximum, default and unit,
// in a sensible order; finally a strict compile.
export function validatePlatformSchema(schema: unknown): SchemaCheck {
  const errors: string[] = []
  if (schema === null || typeof schema !== 'object' || Array.isArray(schema)) return { ok: false, errors: ['The schema must be a JSON object'] }
  const refused = refusedKeywords(schema)
  if (refused.length) return { ok: false, errors: refused.map(describeRefusal), refused }
  const s = schema as Record<string, unknown>
  if (s.$schema !== JSON_SCHEMA_2020_12) errors.push(`$schema must be "${JSON_SCHEMA_2020_12}"`)
  // Against the 2020-12 meta-schema whatever $schema says, so a wrong draft still gets a clear answer.
  const meta = ajv().getSchema(JSON_SCHEMA_2020_12)
  if (meta && !meta(s)) errors.push(...describeAjvErrors(meta.errors).map(e => `Not valid JSON Schema 2020-12: ${e}`))
  if (s.type !== 'object') errors.push('type must be "object"')
  const props = (s.properties ?? {}) as Record<string, Record<string, unknown>>
  const required = Array.isArray(s.required) ? s.required : []
  for (const name of PARAMETER_NAMES) errors.push(...parameterProblems(name, props[name], required.includes(name)))
  if (errors.length === 0) {
    try {
      createAjv().compile(s) // a fresh instance, so trial compiles leave nothing behind
    } catch (e) {
      errors.push(`Cannot be compiled in strict mode: ${(e as Error).message}`)
    }
  }
  return { ok: errors.length === 0, errors }
}

function parameterProblems(name: string, p: Record<string, unknown> | undefined, isRequired: boolean): string[] {
  if (!p || typeof p !== 'object') return [`properties.${name} is missing: every platform needs all ${PARAMETER_NAMES.length} parameters`]
  const out: string[] = []
  const num = (k: string) => typeof p[k] === 'number' && Number.isFinite(p[k])
  if (!isRequired) out.push(`${name} must be listed in required`)
  if (p.type !== 'number') out.push(`properties.${name}.type must be "number"`)
  for (const k of ['minimum', 'maximum', 'default']) if (!num(k)) out.push(`properties.${name}.${k} must be a number`)
  if (typeof p.unit !== 'string' || p.unit === '') out.push(`properties.${name}.unit must name the unit, e.g. "kW"`)
  if (num('minimum') && num('maximum') && (p.minimum as number) >= (p.maximum as number)) out.push(`properties.${name}: minimum must be below maximum`)
  if (num('default') && num('minimum') && num('maximum') && ((p.default as number) < (p.minimum as number) || (p.default as number) > (p.maximum as number))) {
    out.push(`properties.${name}.default must lie between minimum and maximum`)
  }
  return out
}

// A whole platform as an admin might post it.
export function validatePlatform(platform: unknown): SchemaCheck {
  const p = (platform ?? {}) as Partial<PlatformLike>
  const errors: string[] = []
  if (typeof p.key !== 'string' || !/^[a-z0-9]+(-[a-z0-9]+)*$/.test(p.key)) errors.push('key must be lower-case words joined by hyphens, e.g. "fenlow-45"')
  if (typeof p.name !== 'string' || p.name.trim() === '') errors.push('name is needed')
  if (typeof p.motorMaxRpm !== 'number' || !Number.isFinite(p.motorMaxRpm) || p.motorMaxRpm <= 0) errors.push('motorMaxRpm must be a number of rpm above 0')
  const schemaCheck = validatePlatformSchema(p.schema)
  errors.push(...schemaCheck.errors)
  return { ok: errors.length === 0, errors, ...(schemaCheck.refused ? { refused: schemaCheck.refused } : {}) }
}
