import { z } from 'zod'
import { RULE_IDS } from '../compute/types'

// A draft may hold values the drive unit's schema refuses (they show as hard errors and block submission),
// but only values of the kinds a setting can have: a finite number, on/off, a choice, or a short curve.
const point = z.object({ x: z.number(), y: z.number() }).strict()
const settingValue = z.union([z.number(), z.boolean(), z.string().max(40, 'At most 40 characters'), z.array(point).max(64, 'At most 64 points')],
  { error: 'A number, on/off, a choice or a list of points is needed' })
export const parametersSchema = z.record(z.string().regex(/^[A-Za-z][A-Za-z0-9]{0,39}$/, 'Not a setting this controller has'), settingValue)
  .refine(r => Object.keys(r).length <= 100, 'At most 100 settings')

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
  lockVersion: z.number({ error: 'Reload the version: which one you loaded is needed to save it' }).int().min(0),
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
