import { z } from 'zod'

// The snag list (docs/architecture.md#snags): what a road test or the workshop found on a car, in three kinds.
export const snagKinds = ['conversion', 'remedial', 'enhancement'] as const
export const snagPriorities = ['low', 'normal', 'high', 'urgent'] as const
export const snagStatuses = ['open', 'in-hand', 'done', 'declined'] as const
export type SnagKind = typeof snagKinds[number]
export type SnagPriority = typeof snagPriorities[number]
export type SnagStatus = typeof snagStatuses[number]

export const snagKindLabels: Record<SnagKind, string> = {
  conversion: 'Conversion fault',
  remedial: 'Remedial work on the car',
  enhancement: 'Enhancement to offer'
}
export const snagPriorityLabels: Record<SnagPriority, string> = { low: 'Low', normal: 'Normal', high: 'High', urgent: 'Urgent' }
export const snagStatusLabels: Record<SnagStatus, string> = { 'open': 'Open', 'in-hand': 'In hand', 'done': 'Done', 'declined': 'Declined' }
// Most pressing first (urgent … low); a stable sort keeps the order within a priority.
export const mostPressingFirst = <T extends { priority: string }>(list: T[]): T[] =>
  [...list].sort((a, b) => snagPriorities.indexOf(b.priority as SnagPriority) - snagPriorities.indexOf(a.priority as SnagPriority))
// Open and in hand both still need doing.
export const unresolvedSnagStatuses: SnagStatus[] = ['open', 'in-hand']

const fields = {
  kind: z.enum(snagKinds, { error: 'Choose a kind' }),
  title: z.string({ error: 'A title is needed' }).trim().min(1, 'A title is needed').max(160, 'At most 160 characters'),
  detail: z.string().trim().max(4000, 'At most 4000 characters').default(''),
  priority: z.enum(snagPriorities).default('normal'),
  status: z.enum(snagStatuses).default('open'),
  assigneeId: z.number().int().positive().nullable().default(null),
  blocking: z.boolean().default(false),
  roadTestId: z.number().int().positive().nullable().default(null)
}

export const snagCreateSchema = z.object(fields).strict()
export const snagUpdateSchema = z.object({
  kind: fields.kind, title: fields.title, detail: z.string().trim().max(4000), priority: z.enum(snagPriorities),
  status: z.enum(snagStatuses), assigneeId: z.number().int().positive().nullable(), blocking: z.boolean()
}).partial().strict()
export type SnagCreate = z.output<typeof snagCreateSchema>
export type SnagUpdate = z.output<typeof snagUpdateSchema>

export const snagListQuerySchema = z.object({
  kind: z.enum(snagKinds).optional(),
  status: z.union([z.enum(snagStatuses), z.literal('unresolved')]).optional(),
  priority: z.enum(snagPriorities).optional(),
  blocking: z.enum(['true', 'false']).transform(v => v === 'true').optional(),
  assigneeId: z.coerce.number().int().positive().optional()
})
export type SnagListQuery = z.output<typeof snagListQuerySchema>

export interface SnagPhotoView { id: number, filename: string, caption: string, bytes: number, hasThumbnail: boolean }
export interface SnagView {
  id: number
  vehicleId: number
  vehicle?: { id: number, stockRef: string, make: string, model: string }
  roadTestId: number | null
  kind: SnagKind
  title: string
  detail: string
  priority: SnagPriority
  status: SnagStatus
  assignee: { id: number, name: string } | null
  blocking: boolean
  createdBy: { id: number, name: string } | null
  photos: SnagPhotoView[]
  createdAt: string
  updatedAt: string
}
