// The one check of the settings a request brings against its drive unit (docs/computation.md#settings), for
// every way settings come in: versions, the roadside, read-backs and the tune sheet's evaluate. Every setting
// must be one the unit has (refused before anything else looks at them, so no schema keyword ever sees a
// stranger's name); where the values are kept, each must also be of its setting's kind. The tune sheet only
// tries values, and the unit's schema then names a wrong one beside its field.
import { foreignSettings } from '../../../shared/compute/setting-kinds'

interface DriveUnit { name: string, schema: unknown }

export function requireKnownSettings(
  platform: DriveUnit | null | undefined,
  values: Record<string, unknown> | undefined,
  { prefix = 'parameters', kinds = true }: { prefix?: string, kinds?: boolean } = {}
): void {
  if (!values) return
  const unit = platform ? `the ${platform.name}` : 'this drive unit'
  const { unknown, wrongKind } = foreignSettings(platform?.schema, values)
  const fields = [
    ...unknown.map(n => ({ path: `${prefix}.${n}`, message: `Not a setting of ${unit}` })),
    ...(kinds ? wrongKind.map(w => ({ path: `${prefix}.${w.name}`, message: w.message })) : [])
  ]
  if (!fields.length) return
  const message = unknown.length
    ? `Not settings of ${unit}: ${unknown.join(', ')}`.slice(0, 500)
    : `Please check: ${fields.map(f => f.path).join(', ')} (not values these settings can hold)`
  throw createError({ statusCode: 400, message, data: { fields, unknown } })
}
