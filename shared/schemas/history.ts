import { z } from 'zod'

// A day ("2026-12-01") or a moment ("2026-12-01T09:30:00Z"); a day given as `to` includes the whole day.
const dayOrMoment = z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: 'A date (YYYY-MM-DD) or an ISO time' })

export const historyQuerySchema = z.object({
  cursor: z.string().regex(/^\d{1,18}$/, 'An event id from nextCursor').optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().trim().max(80).regex(/^[a-z0-9.-]*$/, 'An action such as vehicle.updated, or a family such as version.').optional(),
  actorId: z.coerce.number().int().positive().max(2147483647).optional(),
  from: dayOrMoment.optional(),
  to: dayOrMoment.optional(),
  // include=record adds each event's exact hashed record (docs/history.md), for checking the hashes outside.
  include: z.literal('record', { error: 'include=record is the only choice' }).optional()
}).strict()
export type HistoryQuery = z.output<typeof historyQuerySchema>

export const activityQuerySchema = historyQuerySchema.extend({
  vehicleId: z.coerce.number().int().positive().max(2147483647).optional()
}).strict()
export type ActivityQuery = z.output<typeof activityQuerySchema>

// A head an auditor noted earlier: the event id and its hash, "1234:ab12…" (64 hex digits).
export const verifyQuerySchema = z.object({
  head: z.string().trim().toLowerCase().regex(/^\d{1,18}:[0-9a-f]{64}$/, 'A head is the event number, a colon and its 64-character hash')
    .transform((h) => { const [id, hash] = h.split(':'); return { id: String(BigInt(id!)), hash: hash! } }).optional()
}).strict()

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
  // The name recorded in the event (form 2), else the person's current name (form 1 recorded only the id).
  actor: { id: number, name: string, recorded: boolean } | null
  changes: ChangeRow[]
  details: Record<string, unknown>
  names: EventNames
  hash: string
  prevHash: string | null
  form: number
  // Only with include=record: exactly what the hash covers (form 1: without prevHash; form 2: with it).
  record?: Record<string, unknown>
}

export interface HistoryPage { items: HistoryEntry[], nextCursor: string | null }

export interface VerifyResult {
  ok: boolean
  checked: number
  firstBroken: { id: string, createdAt: string, problem: 'link' | 'content', message: string } | null
  head: { id: string, hash: string } | null
  // With ?head=id:hash: whether that earlier head is still in the chain unchanged.
  notedHead?: { id: string, hash: string, ok: boolean, problem: 'missing' | 'changed' | null, message: string }
  durationMs: number
}

// Asking for the head mail now: to the workshop's auditors and whoever asked (the default), or to the asker only.
export const headMailBodySchema = z.object({
  to: z.enum(['auditors', 'me'], { error: 'Either auditors (the workshop\'s auditors and you) or me' }).default('auditors')
}).strict().optional()
