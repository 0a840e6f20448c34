// Checks a profile's parameters against the platform's schema, by hand (no code generation, so the
// browser can run it under a strict content security policy), and yields usable values regardless.
import { withUnit } from './format'
import { DERATE_PAIRS, isParameterName, PARAMETER_NAMES, type Parameters } from './parameters'
import type { EvaluationError, ParameterProperty, PlatformLike } from './types'

type LooseProperty = Partial<Record<keyof ParameterProperty, unknown>>

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x)

export function schemaProperties(schema: unknown): Record<string, LooseProperty> {
  const props = (schema as { properties?: unknown } | null)?.properties
  return props !== null && typeof props === 'object' ? props as Record<string, LooseProperty> : {}
}

// A value off the step grid, allowing for binary fractions such as 0.1.
export function offStep(value: number, step: number): boolean {
  const q = value / step
  return Math.abs(q - Math.round(q)) > 1e-9 * Math.max(1, Math.abs(q))
}

export function readParameters(platform: PlatformLike, input: unknown): { values: Parameters, errors: EvaluationError[] } {
  const given = (input !== null && typeof input === 'object' ? input : {}) as Record<string, unknown>
  const props = schemaProperties(platform.schema)
  const errors: EvaluationError[] = []
  const values = {} as Parameters
  for (const name of PARAMETER_NAMES) {
    const prop = props[name] ?? {}
    const path = `parameters.${name}`
    const lo = finite(prop.minimum) ? prop.minimum : Number.NEGATIVE_INFINITY
    const hi = finite(prop.maximum) ? prop.maximum : Number.POSITIVE_INFINITY
    const unit = typeof prop.unit === 'string' ? prop.unit : undefined
    const label = typeof prop.title === 'string' ? prop.title : name
    const fallback = finite(prop.default) ? prop.default : Math.min(hi, Math.max(lo, 0))
    if (props[name] === undefined) {
      errors.push({ path: `platform.schema.properties.${name}`, message: `The ${platform.name} schema does not define ${name}` })
    }
    const raw = given[name]
    values[name] = finite(raw) ? Math.min(hi, Math.max(lo, raw)) : fallback
    if (raw === undefined || raw === null) {
      errors.push({ path, message: `${label} is missing; the ${platform.name} default is ${withUnit(fallback, unit)}` })
    } else if (!finite(raw)) {
      errors.push({ path, message: `${label} must be a number` })
    } else if (raw < lo) {
      errors.push({ path, message: `${label} must be at least ${withUnit(lo, unit)} on the ${platform.name}` })
    } else if (raw > hi) {
      errors.push({ path, message: `${label} must be at most ${withUnit(hi, unit)} on the ${platform.name}` })
    } else if (finite(prop.multipleOf) && prop.multipleOf > 0 && offStep(raw, prop.multipleOf)) {
      errors.push({ path, message: `${label} goes in steps of ${withUnit(prop.multipleOf, unit)} on the ${platform.name}` })
    }
  }
  for (const key of Object.keys(given)) {
    if (!isParameterName(key)) errors.push({ path: `parameters.${key}`, message: `"${key}" is not a setting of the ${platform.name}` })
  }
  return { values, errors: [...errors, ...derateOrderErrors(values, props)] }
}

// A derate start at or above its cut-off leaves no fade at all: torque would drop from full to nothing.
export function derateOrderErrors(values: Parameters, props: Record<string, LooseProperty> = {}): EvaluationError[] {
  return DERATE_PAIRS.filter(p => !(values[p.start] < values[p.cutoff])).map(p => {
    const unit = typeof props[p.start]?.unit === 'string' ? props[p.start]!.unit as string : '°C'
    return {
      path: `parameters.${p.start}`,
      message: `The ${p.sensor} derate start (${withUnit(values[p.start], unit)}) must be below the ${p.sensor} cut-off (${withUnit(values[p.cutoff], unit)}), or torque would drop from full to nothing at once`
    }
  })
}
