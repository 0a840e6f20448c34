// Voltwright's drive-unit families. The ajv helpers live in ./ajv, kept out of this barrel because
// ajv compiles code at run time, which the browser's content security policy forbids.
import type { ParameterName, Parameters } from '../compute/parameters'
import { PARAMETER_NAMES } from '../compute/parameters'
import { schemaProperties } from '../compute/parameter-input'
import type { Platform, PlatformLike } from '../compute/types'
import { ulvane220 } from './ulvane-220'
import { marrick110 } from './marrick-110'
import { fenlow45 } from './fenlow-45'

export const platforms: readonly Platform[] = [fenlow45, marrick110, ulvane220]

export function findPlatform(key: string): Platform | undefined {
  return platforms.find(p => p.key === key)
}

// Every parameter at the platform's default, the starting point of a new profile.
export function defaultParameters(platform: PlatformLike): Parameters {
  const props = schemaProperties(platform.schema)
  const values = {} as Record<ParameterName, number>
  for (const name of PARAMETER_NAMES) {
    const def = props[name]?.default
    values[name] = typeof def === 'number' && Number.isFinite(def) ? def : 0
  }
  return values
}

export { fenlow45, marrick110, ulvane220 }
export { definePlatform, parameter, JSON_SCHEMA_2020_12, type ParameterLine } from './define'
