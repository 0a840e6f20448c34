import { z } from 'zod'
import { vehicleSpecSchema } from './vehicle-spec'

// POST /api/evaluate: a car (stored, or its spec as typed) with a drive unit and a set of its settings.
// Parameters are any plain values here: their ranges are the platform schema's business, reported in `errors`;
// a name the schema does not define is refused (server/utils/platforms/evaluation.ts).
export const evaluateRequestSchema = z.object({
  vehicleId: z.number().int().positive().max(2147483647).optional(),
  spec: vehicleSpecSchema.optional(),
  platformKey: z.string({ error: 'Name the drive unit' }).trim().min(1, 'Name the drive unit').max(60),
  parameters: z.record(z.string().max(100), z.union([z.number(), z.string().max(100), z.boolean(), z.null()], { error: 'A number is needed' }), { error: 'The settings must be an object of name and value' })
    .refine(p => Object.keys(p).length <= 64, 'At most 64 settings')
}).strict().superRefine((body, ctx) => {
  if ((body.vehicleId === undefined) === (body.spec === undefined)) {
    ctx.addIssue({ code: 'custom', path: ['vehicleId'], message: 'Give either a car (vehicleId) or its spec, not both and not neither' })
  }
})

export type EvaluateRequest = z.output<typeof evaluateRequestSchema>
