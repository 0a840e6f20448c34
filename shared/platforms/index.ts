// Voltwright's drive-unit families. The ajv helpers live in ./ajv, kept out of this barrel because
// ajv compiles code at run time, which the browser's content security policy forbids.
import { schemaProperties, type SettingValues } from '../compute/parameter-input'
import { fallbackValue } from '../compute/setting-kinds'
import type { Platform, PlatformLike } from '../compute/types'
import { ulvane220 } from './ulvane-220'
import { marrick110 } from './marrick-110'
import { fenlow45 } from './fenlow-45'
import { corvath130 } from './corvath-130'
import { peltry70 } from './peltry-70'
import { quennel95 } from './quennel-95'

// The first three came with the register; the other three show controllers with settings of their own.
export const firstPlatforms: readonly Platform[] = [fenlow45, marrick110, ulvane220]
export const morePlatforms: readonly Platform[] = [corvath130, peltry70, quennel95]
export const platforms: readonly Platform[] = [...firstPlatforms, ...morePlatforms]

export function findPlatform(key: string): Platform | undefined {
  return platforms.find(p => p.key === key)
}

// Every setting at the platform's default, the starting point of a new profile.
export function defaultParameters(platform: PlatformLike): SettingValues {
  const props = schemaProperties(platform.schema)
  return Object.fromEntries(Object.entries(props).map(([name, p]) => [name, fallbackValue(p)]))
}

export { fenlow45, marrick110, ulvane220, corvath130, peltry70, quennel95 }
export { definePlatform, parameter, platformOf, JSON_SCHEMA_2020_12, type ParameterLine } from './define'
