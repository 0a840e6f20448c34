// Reads a vehicle spec for evaluation: errors for what is wrong, and a usable spec regardless.
import { vehicleSpecSchema, type VehicleSpec } from '../schemas/vehicle-spec'
import { exampleSpec } from './example'
import type { EvaluationError } from './types'

export const TYRE_FIELDS = ['tyreSize', 'tyreSizeFront', 'tyreSizeRear'] as const

type FieldSchema = { safeParse: (x: unknown) => { success: boolean, data?: unknown }, def: { type: string, innerType?: { minValue?: number | null, maxValue?: number | null } }, minValue?: number | null, maxValue?: number | null }

export function readSpec(input: unknown): { spec: VehicleSpec, errors: EvaluationError[] } {
  const parsed = vehicleSpecSchema.safeParse(input)
  if (parsed.success) return { spec: parsed.data, errors: [] }
  const errors = parsed.error.issues
    // Tyre sizes get the tyre reader's more specific messages instead.
    .filter(issue => !(TYRE_FIELDS as readonly PropertyKey[]).includes(issue.path[0] ?? ''))
    .map(issue => ({ path: ['spec', ...issue.path.map(String)].join('.'), message: issue.message }))
  return { spec: repairSpec(input), errors }
}

// Out-of-range numbers are clamped into range; anything unusable takes the example car's value.
function repairSpec(input: unknown): VehicleSpec {
  const raw = (input !== null && typeof input === 'object' ? input : {}) as Record<string, unknown>
  const out: Record<string, unknown> = {}
  const shape = vehicleSpecSchema.shape as unknown as Record<string, FieldSchema>
  for (const [key, field] of Object.entries(shape)) {
    const candidate = clampToField(raw[key], field)
    const checked = field.safeParse(candidate)
    const fallback = (exampleSpec as Record<string, unknown>)[key]
    if (checked.success) out[key] = checked.data
    else if (TYRE_FIELDS.includes(key as typeof TYRE_FIELDS[number])) out[key] = typeof raw[key] === 'string' ? raw[key] : fallback === undefined ? undefined : ''
    else out[key] = fallback
  }
  return out as VehicleSpec
}

function clampToField(value: unknown, field: FieldSchema): unknown {
  if (typeof value !== 'number' || !Number.isFinite(value)) return value
  const bounds = field.def.type === 'default' ? field.def.innerType : field
  const lo = bounds?.minValue ?? Number.NEGATIVE_INFINITY
  const hi = bounds?.maxValue ?? Number.POSITIVE_INFINITY
  return Math.min(hi, Math.max(lo, value))
}
