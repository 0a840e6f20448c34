import { z } from 'zod'

// A day ("2026-12-01") or a moment ("2026-12-01T09:30:00Z"); a day given as `to` includes the whole day.
const dayOrMoment = z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: 'A date (YYYY-MM-DD) or an ISO time' })

export const historyQuerySchema = z.object({
  cursor: z.string().regex(/^\d{1,18}$/, 'An event id from nextCursor').optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().trim().max(80).regex(/^[a-z0-9.-]*$/, 'An action such as vehicle.updated, or a family such as version.').optional(),
  actorId: z.coerce.number().int().positive().max(2147483647).optional(),
  from: dayOrMoment.optional(),
  to: dayOrMoment.optional()
}).strict()
export type HistoryQuery = z.output<typeof historyQuerySchema>

export const activityQuerySchema = historyQuerySchema.extend({
  vehicleId: z.coerce.number().int().positive().max(2147483647).optional()
}).strict()
export type ActivityQuery = z.output<typeof activityQuerySchema>

export const facetsQuerySchema = z.object({ vehicleId: z.coerce.number().int().positive().max(2147483647).optional() }).strict()

// One changed value, with what it was before when the history can tell (`beforeKnown`).
export interface ChangeRow { path: string, op: string, before?: unknown, after?: unknown, beforeKnown: boolean }

// Names shown in place of record numbers, looked up as the history is read (a version as "Road v12").
export interface EventNames {
  version?: string
  parentVersion?: string
  supersededVersion?: string
  person?: string
  snag?: string
  people: Record<string, string>
}

export interface HistoryEntry {
  id: string
  createdAt: string
  action: string
  entityType: string
  entityId: string
  vehicle: { id: number, stockRef: string } | null
  actor: { id: number, name: string } | null
  changes: ChangeRow[]
  details: Record<string, unknown>
  names: EventNames
  hash: string
  prevHash: string | null
}

export interface HistoryPage { items: HistoryEntry[], nextCursor: string | null }

export interface VerifyResult {
  ok: boolean
  checked: number
  firstBroken: { id: string, createdAt: string, problem: 'link' | 'content', message: string } | null
  head: { id: string, hash: string } | null
  durationMs: number
}
