// Builds a platform's parameter schema (JSON Schema 2020-12) from one line per parameter.
import { PARAMETER_NAMES, type ParameterName } from '../compute/parameters'
import { roleOfField } from '../compute/role-needs'
import type { ParameterProperty, Platform, PlatformSchema, SettingProperty } from '../compute/types'

export const JSON_SCHEMA_2020_12 = 'https://json-schema.org/draft/2020-12/schema'

// [title, unit, minimum, maximum, step, default, description]
export type ParameterLine = [string, string, number, number, number, number, string]

// Cross-field rules that plain JSON Schema keywords cannot state; evaluate() enforces them.
const CROSS_FIELD_RULES = 'Each derate start (motor, inverter, battery) must be below its cut-off; Voltwright checks this when it evaluates a profile.'

export function parameter([title, unit, minimum, maximum, multipleOf, def, description]: ParameterLine, role?: string): ParameterProperty {
  const p: ParameterProperty = { type: 'number', title, description, unit, minimum, maximum, multipleOf, default: def }
  return role ? { ...p, 'x-role': role } : p
}

// A drive unit from its own settings, in the order given; every setting is required.
export function platformOf(key: string, name: string, motorMaxRpm: number, description: string, properties: Record<string, SettingProperty>, torqueConstantNmPerA?: number): Platform {
  const schema: PlatformSchema = {
    $schema: JSON_SCHEMA_2020_12,
    title: `${name} settings`,
    description,
    type: 'object',
    properties,
    required: Object.keys(properties),
    additionalProperties: false
  }
  return torqueConstantNmPerA === undefined ? { key, name, motorMaxRpm, schema } : { key, name, motorMaxRpm, torqueConstantNmPerA, schema }
}

export function definePlatform(key: string, name: string, motorMaxRpm: number, summary: string, lines: Record<ParameterName, ParameterLine>): Platform {
  const properties: Record<string, ParameterProperty> = {}
  for (const p of PARAMETER_NAMES) properties[p] = parameter(lines[p], roleOfField(p))
  const platform = platformOf(key, name, motorMaxRpm, `${summary} ${CROSS_FIELD_RULES}`, properties)
  return { ...platform, schema: { ...platform.schema, title: `${name} parameters` } }
}
