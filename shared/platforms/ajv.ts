// Server-side JSON Schema tools for platform schemas (ajv compiles code, so not for the browser).
import Ajv2020, { type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js'
import type { PlatformLike } from '../compute/types'
import { JSON_SCHEMA_2020_12 } from './define'
import { settingsProblems } from './schema-checks'
import { describeRefusal, refusedKeywords, type RefusedKeyword } from './keywords'

// Strict mode rejects unknown keywords, so Voltwright's own (unit, roles, choice labels, rising curves) are declared.
export function createAjv(): Ajv2020 {
  const ajv = new Ajv2020({ strict: true, allErrors: true, multipleOfPrecision: 9 })
  ajv.addKeyword({ keyword: 'unit', schemaType: 'string', metaSchema: { type: 'string', minLength: 1 } })
  ajv.addKeyword({ keyword: 'x-role', schemaType: 'string', metaSchema: { type: 'string' } })
  ajv.addKeyword({ keyword: 'x-enumTitles', schemaType: 'array', metaSchema: { type: 'array', items: { type: 'string' } } })
  ajv.addKeyword({ keyword: 'x-monotonic', schemaType: 'boolean', metaSchema: { type: 'boolean' } })
  return ajv
}

let shared: Ajv2020 | null = null
const ajv = (): Ajv2020 => (shared ??= createAjv())
// The most recently used validators, at most MAX_VALIDATORS of them, so that a workshop uploading schema after
// schema cannot grow the server's memory without end; the least recently used is dropped, and ajv's own copy with it.
export const MAX_VALIDATORS = 256
// Keyed by the platform's key and its schema's JSON text, so an edited schema under the same key is compiled
// anew; a schema the keyword allow-list refuses is kept as refused, so neither check runs twice per schema.
const validators = new Map<string, { validate: ValidateFunction | null, schema: object | null }>()
export const cachedValidatorCount = () => validators.size

// A validator for a platform's parameters, compiled once per platform key and schema; none for a schema
// stored before the keyword allow-list that it now refuses (ajv never compiles a user's regular expression).
export function compileParameterValidator(platform: PlatformLike): ValidateFunction | null {
  const key = `${platform.key}\n${JSON.stringify(platform.schema)}`
  const cached = validators.get(key)
  if (cached) {
    validators.delete(key)
    validators.set(key, cached)
    return cached.validate
  }
  const entry = compileEntry(platform.schema)
  validators.set(key, entry)
  if (validators.size > MAX_VALIDATORS) {
    const [oldest, dropped] = validators.entries().next().value!
    validators.delete(oldest)
    if (dropped.schema) ajv().removeSchema(dropped.schema)
  }
  return entry.validate
}

function compileEntry(stored: unknown): { validate: ValidateFunction | null, schema: object | null } {
  if (refusedKeywords(stored).length) return { validate: null, schema: null }
  // Without $id, so an edited schema under the same id does not clash with the one compiled before.
  const { $id: _id, ...schema } = stored as Record<string, unknown>
  return { validate: ajv().compile(schema), schema }
}

export function describeAjvErrors(errors: ErrorObject[] | null | undefined): string[] {
  return (errors ?? []).map(e => `${e.instancePath || '(top level)'} ${e.message ?? 'is not valid'}`.trim())
}

export interface SchemaCheck { ok: boolean, errors: string[], refused?: RefusedKeyword[] }

// First the keyword allow-list (./keywords), so nothing else ever sees a refused keyword; then the 2020-12
// meta-schema, then Voltwright's own needs (./schema-checks); finally a strict compile.
// Each problem starts with its JSON pointer into the schema.
export function validatePlatformSchema(schema: unknown, facts: { torqueConstantNmPerA?: unknown } = {}): SchemaCheck {
  const errors: string[] = []
  if (schema === null || typeof schema !== 'object' || Array.isArray(schema)) return { ok: false, errors: ['The schema must be a JSON object'] }
  const refused = refusedKeywords(schema)
  if (refused.length) return { ok: false, errors: refused.map(describeRefusal), refused }
  const s = schema as Record<string, unknown>
  if (s.$schema !== JSON_SCHEMA_2020_12) errors.push(`/$schema: must be "${JSON_SCHEMA_2020_12}"`)
  // Against the 2020-12 meta-schema whatever $schema says, so a wrong draft still gets a clear answer.
  const meta = ajv().getSchema(JSON_SCHEMA_2020_12)
  if (meta && !meta(s)) errors.push(...describeAjvErrors(meta.errors).map(e => `Not valid JSON Schema 2020-12: ${e}`))
  if (s.type !== 'object') errors.push('/type: must be "object"')
  errors.push(...settingsProblems(s, facts))
  const names = Object.keys((s.properties ?? {}) as object)
  const required = Array.isArray(s.required) ? s.required : []
  const unlisted = names.filter(n => !required.includes(n))
  if (unlisted.length) errors.push(`/required: must list every setting (missing ${unlisted.slice(0, 5).join(', ')})`)
  if (errors.length === 0) {
    try {
      createAjv().compile(s) // a fresh instance, so trial compiles leave nothing behind
    } catch (e) {
      errors.push(`Cannot be compiled in strict mode: ${(e as Error).message}`)
    }
  }
  return { ok: errors.length === 0, errors }
}

// A whole platform as an admin might post it.
export function validatePlatform(platform: unknown): SchemaCheck {
  const p = (platform ?? {}) as Partial<PlatformLike>
  const errors: string[] = []
  if (typeof p.key !== 'string' || !/^[a-z0-9]+(-[a-z0-9]+)*$/.test(p.key)) errors.push('key must be lower-case words joined by hyphens, e.g. "fenlow-45"')
  if (typeof p.name !== 'string' || p.name.trim() === '') errors.push('name is needed')
  if (typeof p.motorMaxRpm !== 'number' || !Number.isFinite(p.motorMaxRpm) || p.motorMaxRpm <= 0) errors.push('motorMaxRpm must be a number of rpm above 0')
  const k = p.torqueConstantNmPerA
  if (k !== undefined && k !== null && !(typeof k === 'number' && Number.isFinite(k) && k > 0)) errors.push('torqueConstantNmPerA must be a number of N·m per A above 0')
  const schemaCheck = validatePlatformSchema(p.schema, { torqueConstantNmPerA: k })
  errors.push(...schemaCheck.errors)
  return { ok: errors.length === 0, errors, ...(schemaCheck.refused ? { refused: schemaCheck.refused } : {}) }
}
