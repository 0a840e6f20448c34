// The JSON Schema keywords an uploaded drive-unit schema may use: an allow-list, so that no regular
// expression (`pattern`, `patternProperties`, `propertyNames`, `format`), no `$ref` and nothing costly
// reaches ajv from a user. To accept a new keyword, add one line here saying what its value holds
// (docs/security.md).

// What a keyword's value may be: `schema` is a subschema or true/false, walked in turn; `schemas` an object
// of setting name to subschema; `value` any JSON value that is data, never walked as a schema.
export type KeywordValue = 'schema' | 'schemas' | 'string' | 'number' | 'names' | 'type' | 'value'

export interface KeywordRule { value: KeywordValue, rootOnly?: boolean }

export const SCHEMA_KEYWORDS: Readonly<Record<string, KeywordRule>> = {
  $schema: { value: 'string', rootOnly: true },
  $id: { value: 'string', rootOnly: true },
  title: { value: 'string' },
  description: { value: 'string' },
  type: { value: 'type' },
  properties: { value: 'schemas' },
  required: { value: 'names' },
  additionalProperties: { value: 'schema' },
  minimum: { value: 'number' },
  maximum: { value: 'number' },
  exclusiveMinimum: { value: 'number' },
  exclusiveMaximum: { value: 'number' },
  multipleOf: { value: 'number' },
  default: { value: 'value' },
  unit: { value: 'string' },
  // Settings that are not plain numbers (docs/computation.md#settings): choices, switches and curves.
  'enum': { value: 'value' },
  'items': { value: 'schema' },
  'minItems': { value: 'number' },
  'maxItems': { value: 'number' },
  // Voltwright's own: the quantity the physics reads a setting as, a choice's labels, a curve that never falls.
  'x-role': { value: 'string' },
  'x-enumTitles': { value: 'value' },
  'x-monotonic': { value: 'value' }
}

// Bounds on the schema's shape, so that walking or compiling it costs little whatever was uploaded.
export const SCHEMA_LIMITS = { depth: 6, subschemas: 500, settingName: 60, text: 2000 } as const

export interface RefusedKeyword { pointer: string, keyword: string, reason: string }

const escapePointer = (name: string) => name.replace(/~/g, '~0').replace(/\//g, '~1')
const isObject = (x: unknown): x is Record<string, unknown> => x !== null && typeof x === 'object' && !Array.isArray(x)
const SETTING_NAME = /^[A-Za-z][A-Za-z0-9_]*$/ // our own, linear

// Only what bounds the walk is checked here; a value of the wrong type is the 2020-12 meta-schema's to report.
function valueProblem(kind: KeywordValue, v: unknown): string | null {
  if (kind === 'string' && typeof v === 'string' && v.length > SCHEMA_LIMITS.text) return `must be at most ${SCHEMA_LIMITS.text} characters`
  if (kind === 'names' && Array.isArray(v) && v.length > SCHEMA_LIMITS.subschemas) return `may name at most ${SCHEMA_LIMITS.subschemas} settings`
  return null
}

// Every keyword of `schema` not on the allow-list (or out of bounds), with its JSON pointer (RFC 6901).
// Walks without recursion and stops early, so a hostile schema costs no more than the limits allow.
export function refusedKeywords(schema: unknown): RefusedKeyword[] {
  const refused: RefusedKeyword[] = []
  const stack: { node: unknown, pointer: string, depth: number }[] = [{ node: schema, pointer: '', depth: 0 }]
  let seen = 0
  while (stack.length && refused.length < 100) {
    const { node, pointer, depth } = stack.pop()!
    if (!isObject(node)) continue // true, false, or what the meta-schema refuses
    if (++seen > SCHEMA_LIMITS.subschemas || depth > SCHEMA_LIMITS.depth) {
      refused.push({ pointer, keyword: '', reason: `a schema may hold at most ${SCHEMA_LIMITS.subschemas} subschemas, ${SCHEMA_LIMITS.depth} deep` })
      break
    }
    for (const [keyword, value] of Object.entries(node)) {
      const at = `${pointer}/${escapePointer(keyword)}`
      const rule = Object.hasOwn(SCHEMA_KEYWORDS, keyword) ? SCHEMA_KEYWORDS[keyword]! : undefined
      if (!rule || (rule.rootOnly && depth > 0)) {
        refused.push({ pointer: at, keyword, reason: rule ? 'is allowed only at the top of the schema' : 'is not among the keywords Voltwright accepts' })
        continue
      }
      const problem = valueProblem(rule.value, value)
      if (problem) refused.push({ pointer: at, keyword, reason: problem })
      else if (rule.value === 'schema' && isObject(value)) stack.push({ node: value, pointer: at, depth: depth + 1 })
      else if (rule.value === 'schemas' && isObject(value)) {
        for (const [name, sub] of Object.entries(value as Record<string, unknown>)) {
          const subAt = `${at}/${escapePointer(name)}`
          if (name.length > SCHEMA_LIMITS.settingName || !SETTING_NAME.test(name)) refused.push({ pointer: subAt, keyword, reason: `a setting name is a letter then letters, digits or _, at most ${SCHEMA_LIMITS.settingName} long` })
          else stack.push({ node: sub, pointer: subAt, depth: depth + 1 })
        }
      }
    }
  }
  return refused.sort((a, b) => a.pointer < b.pointer ? -1 : a.pointer > b.pointer ? 1 : 0)
}

export function describeRefusal(r: RefusedKeyword): string {
  return r.keyword ? `${r.pointer}: "${r.keyword}" ${r.reason}` : `${r.pointer || '(top level)'}: ${r.reason}`
}

// The settings a body names that the drive unit's schema does not define: refused before anything checks their values.
export function unknownSettings(schema: unknown, names: Iterable<string>): string[] {
  const props = isObject(schema) && isObject(schema.properties) ? schema.properties : {}
  return [...names].filter(n => !Object.hasOwn(props, n))
}
