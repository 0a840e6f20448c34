import { z } from 'zod'
import { PARAMETER_NAMES } from '../compute/parameters'
import { RULE_IDS } from '../compute/types'

// A draft may hold values the checks refuse (they show as hard errors and block submission), but only
// finite numbers for the controller's known settings.
export const parametersSchema = z.partialRecord(z.enum(PARAMETER_NAMES, { error: 'Not a setting this controller has' }), z.number({ error: 'A number is needed' }))

const rationale = z.string().trim().max(4000, 'At most 4000 characters')

export const profileCreateSchema = z.object({
  name: z.string({ error: 'A name is needed' }).trim().min(1, 'A name is needed').max(40, 'At most 40 characters'),
  parameters: parametersSchema.optional(),
  rationale: rationale.default('')
}).strict()
export type ProfileCreate = z.output<typeof profileCreateSchema>

export const versionCreateSchema = z.object({
  fromVersionId: z.number().int().positive().max(2147483647).optional(),
  parameters: parametersSchema.optional(),
  rationale: rationale.default('')
}).strict()
export type VersionCreate = z.output<typeof versionCreateSchema>

export const versionUpdateSchema = z.object({
  lockVersion: z.number({ error: 'The lockVersion you loaded is needed' }).int().min(0),
  parameters: parametersSchema.optional(),
  rationale: rationale.optional()
}).strict()
export type VersionUpdate = z.output<typeof versionUpdateSchema>

// A written reason per safety rule that warns of danger, rule by rule (docs/version-lifecycle.md).
export const justificationsSchema = z.partialRecord(z.enum(RULE_IDS, { error: 'Not a safety rule' }), z.string().trim().max(2000, 'At most 2000 characters')).default({})

export const submitSchema = z.object({ justifications: justificationsSchema }).strict()
export type SubmitInput = z.output<typeof submitSchema>

export const approveSchema = z.object({ comment: z.string().trim().max(2000, 'At most 2000 characters').default('') }).strict()
export const rejectSchema = z.object({
  comment: z.string({ error: 'Say what needs to change' }).trim().min(1, 'Say what needs to change').max(2000, 'At most 2000 characters')
}).strict()
export type DecisionInput = z.output<typeof approveSchema>

const versionId = z.coerce.number().int().positive().max(2147483647)
export const diffParamsSchema = z.object({ id: versionId, other: versionId })
