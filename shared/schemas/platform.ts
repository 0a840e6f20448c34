import { z } from 'zod'

// An admin's upload of a drive unit; the schema itself is checked against JSON Schema 2020-12 and
// Voltwright's needs on the server (shared/platforms/ajv.ts), which lists every problem it finds.
export const platformUploadSchema = z.object({
  key: z.string({ error: 'A key is needed' }).trim().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Lower-case words joined by hyphens, e.g. "fenlow-45"').max(60),
  name: z.string({ error: 'A name is needed' }).trim().min(1, 'A name is needed').max(80),
  motorMaxRpm: z.number({ error: 'A number of rpm is needed' }).int('Whole rpm').positive('Must be above zero').max(100000, 'At most 100000 rpm'),
  torqueConstantNmPerA: z.number({ error: 'A number of N·m per A is needed' }).positive('Must be above zero').max(100, 'At most 100 N·m per A').optional(),
  schema: z.record(z.string(), z.unknown(), { error: 'The schema must be a JSON object' })
}).strict()

export type PlatformUpload = z.output<typeof platformUploadSchema>

export const platformKeyParamSchema = z.object({ key: z.string().min(1).max(60) })
