// A version's settings must be ones its car's drive unit has, each of its kind (docs/computation.md#settings).
import { foreignSettings } from '../../../shared/compute/setting-kinds'

export function requireKnownSettings(schema: unknown, values: Record<string, unknown> | undefined, prefix = 'parameters'): void {
  if (!values) return
  const fields = foreignSettings(schema, values, prefix)
  if (fields.length) {
    throw createError({ statusCode: 400, message: `Please check: ${fields.map(f => f.path).join(', ')} (not settings of this drive unit, or not values they can hold)`, data: { fields } })
  }
}
