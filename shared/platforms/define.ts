// Builds a platform's parameter schema (JSON Schema 2020-12) from one line per parameter.
import { PARAMETER_NAMES, type ParameterName } from '../compute/parameters'
import type { ParameterProperty, Platform, PlatformSchema } from '../compute/types'

export const JSON_SCHEMA_2020_12 = 'https://json-schema.org/draft/2020-12/schema'

// [title, unit, minimum, maximum, step, default, description]
export type ParameterLine = [string, string, number, number, number, number, string]

// Cross-field rules that plain JSON Schema keywords cannot state; evaluate() enforces them.
const CROSS_FIELD_RULES = 'Each derate start (motor, inverter, battery) must be below its cut-off; Voltwright checks this when it evaluates a profile.'

export function parameter([title, unit, minimum, maximum, multipleOf, def, description]: ParameterLine): ParameterProperty {
  return { type: 'number', title, description, unit, minimum, maximum, multipleOf, default: def }
}

export function definePlatform(key: string, name: string, motorMaxRpm: number, summary: string, lines: Record<ParameterName, ParameterLine>): Platform {
  const properties: Record<string, ParameterProperty> = {}
  for (const p of PARAMETER_NAMES) properties[p] = parameter(lines[p])
  const schema: PlatformSchema = {
    $schema: JSON_SCHEMA_2020_12,
    title: `${name} parameters`,
    description: `${summary} ${CROSS_FIELD_RULES}`,
    type: 'object',
    properties,
    required: [...PARAMETER_NAMES],
    additionalProperties: false
  }
  return { key, name, motorMaxRpm, schema }
}
