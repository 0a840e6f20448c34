// Checks a profile's settings against the drive unit's schema, by hand (no code generation, so the
// browser can run it under a strict content security policy), and yields usable values regardless.
import { withUnit } from './format'
import { DERATE_PAIRS } from './parameters'
import type { RoleValues } from './roles'
import { fallbackValue, label, settingKind, settingProblems, usableValue, type LooseProperty, type SettingValue } from './setting-kinds'
import type { EvaluationError, PlatformLike } from './types'

export { offStep } from './setting-kinds'

export type SettingValues = Record<string, SettingValue>

export function schemaProperties(schema: unknown): Record<string, LooseProperty> {
  const props = (schema as { properties?: unknown } | null)?.properties
  return props !== null && typeof props === 'object' ? props as Record<string, LooseProperty> : {}
}

export function readParameters(platform: PlatformLike, input: unknown): { values: SettingValues, errors: EvaluationError[] } {
  const given = (input !== null && typeof input === 'object' ? input : {}) as Record<string, unknown>
  const props = schemaProperties(platform.schema)
  const required = (platform.schema as { required?: unknown } | null)?.required
  const errors: EvaluationError[] = []
  const values: SettingValues = {}
  const where = ` on the ${platform.name}`
  for (const [name, prop] of Object.entries(props)) {
    const path = `parameters.${name}`
    if (settingKind(prop) === undefined) {
      errors.push({ path: `platform.schema.properties.${name}`, message: `The ${platform.name} schema gives ${label(prop, name)} no kind Voltwright can read` })
      continue
    }
    const raw = given[name]
    values[name] = usableValue(raw, prop)
    if (raw === undefined || raw === null) {
      if (!Array.isArray(required) || required.includes(name)) {
        errors.push({ path, message: `${label(prop, name)} is missing; the ${platform.name} default is ${describeFallback(prop)}` })
      }
      continue
    }
    for (const message of settingProblems(raw, prop, name, where)) errors.push({ path, message })
  }
  for (const key of Object.keys(given)) {
    if (!Object.hasOwn(props, key)) errors.push({ path: `parameters.${key}`, message: `"${key}" is not a setting of the ${platform.name}` })
  }
  return { values, errors }
}

function describeFallback(p: LooseProperty): string {
  const v = fallbackValue(p)
  if (typeof v === 'number') return withUnit(v, typeof p.unit === 'string' ? p.unit : undefined)
  if (typeof v === 'boolean') return v ? 'on' : 'off'
  return Array.isArray(v) ? `${v.length} points` : String(v)
}

// A derate start at or above its cut-off leaves no fade at all: torque would drop from full to nothing.
// Checked on the role values (°C), so a unit giving temperatures in another unit is held to the same rule.
export function derateOrderErrors(values: RoleValues, names: Partial<Record<string, string>> = {}): EvaluationError[] {
  return DERATE_PAIRS.flatMap((p) => {
    const start = values[p.start]
    const cutoff = values[p.cutoff]
    if (start === null || cutoff === null || start < cutoff) return []
    return [{
      path: `parameters.${names[p.start] ?? p.start}`,
      message: `The ${p.sensor} derate start (${withUnit(start, '°C')}) must be below the ${p.sensor} cut-off (${withUnit(cutoff, '°C')}), or torque would drop from full to nothing at once`
    }]
  })
}
