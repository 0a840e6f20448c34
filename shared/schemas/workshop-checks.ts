// The workshop's own road-test checks beside the six mandatory drive checks (docs/road-tests.md).
import { z } from 'zod'

export const checkRecords = ['pass-fail', 'number'] as const
export type CheckRecord = typeof checkRecords[number]

export interface WorkshopCheck {
  key: string
  label: string
  record: CheckRecord
  unit: string | null
  min: number | null
  max: number | null
  required: boolean
  platformKeys: string[] | null // null: every drive unit
  retired: boolean
}

// What a road test keeps of each extra check it was recorded with, so a later change never rewrites it.
export type RecordedCheck = Omit<WorkshopCheck, 'retired' | 'platformKeys'>

const label = z.string({ error: 'Say what is checked' }).trim().min(1, 'Say what is checked').max(80, 'At most 80 characters')
const unit = z.string().trim().min(1).max(20, 'At most 20 characters')
const bound = z.number().finite().min(-1e6).max(1e6)
// A unit named twice is kept once.
const platformKeys = z.array(z.string().min(1).max(60)).min(1, 'Choose at least one drive unit, or leave it for all').max(50).transform(keys => [...new Set(keys)])

const rangeInOrder = (c: { min?: number | null, max?: number | null }) => c.min === undefined || c.max === undefined || c.min === null || c.max === null || c.min < c.max

export const workshopCheckCreateSchema = z.object({
  label,
  record: z.enum(checkRecords, { error: 'Choose pass/fail or a number' }),
  unit: unit.optional(),
  min: bound.optional(),
  max: bound.optional(),
  required: z.boolean().default(false),
  platformKeys: platformKeys.optional()
}).strict()
  .refine(rangeInOrder, { path: ['max'], message: 'The highest expected value must be above the lowest' })
  .refine(c => c.record === 'number' || (c.unit === undefined && c.min === undefined && c.max === undefined), { path: ['record'], message: 'Only a number check has a unit and an expected range' })
export type WorkshopCheckCreate = z.output<typeof workshopCheckCreateSchema>

export const workshopCheckPatchSchema = z.object({
  label: label.optional(),
  unit: unit.nullable().optional(),
  min: bound.nullable().optional(),
  max: bound.nullable().optional(),
  required: z.boolean().optional(),
  platformKeys: platformKeys.nullable().optional(),
  retired: z.boolean().optional()
}).strict().refine(rangeInOrder, { path: ['max'], message: 'The highest expected value must be above the lowest' })
export type WorkshopCheckPatch = z.output<typeof workshopCheckPatchSchema>

export const workshopCheckKeyParamSchema = z.object({ key: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/).max(60) })

export { extraCheckResultSchema, type ExtraCheckResult } from './road-test'

// A key from a label: "Heater & demister" → "heater-demister".
export const keyFromLabel = (text: string): string =>
  text.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 50) || 'check'
