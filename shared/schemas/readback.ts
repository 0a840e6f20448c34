import type { SettingValues } from '../compute/parameter-input'
import { z } from 'zod'

// Voltwright's read-back file (docs/readback-format.md): what a car's controller was found to hold.
export const READBACK_FORMAT = 'voltwright-readback/1'

const parameterValues = z.record(
  z.string().regex(/^[a-zA-Z][a-zA-Z0-9]{0,59}$/, 'A parameter name such as powerCapKw'),
  z.union([z.number().finite(), z.boolean(), z.string().max(40), z.array(z.object({ x: z.number().finite(), y: z.number().finite() }).strict()).max(64)],
    { error: 'A number, true or false, a choice or a list of points' })
).refine(p => Object.keys(p).length >= 1, 'At least one parameter').refine(p => Object.keys(p).length <= 64, 'At most 64 parameters')

export const readbackDocumentSchema = z.object({
  format: z.literal(READBACK_FORMAT, { error: `The format must be "${READBACK_FORMAT}"` }),
  vehicle: z.string({ error: 'The car\'s stock ref is needed' }).trim().min(1, 'The car\'s stock ref is needed').max(20),
  profile: z.string({ error: 'The profile\'s name is needed' }).trim().min(1, 'The profile\'s name is needed').max(60),
  readAt: z.iso.datetime({ offset: true, error: 'An ISO 8601 time, e.g. 2026-12-01T09:30:00Z' }),
  controller: z.object({ serial: z.string().trim().max(60).optional(), firmware: z.string().trim().max(40).optional() }).strict().optional(),
  parameters: parameterValues
}).strict()
export type ReadbackDocument = z.output<typeof readbackDocumentSchema>

export const readbackSources = ['file', 'paste', 'typed'] as const
export type ReadbackSource = typeof readbackSources[number]

export const readbackBodySchema = z.discriminatedUnion('source', [
  z.object({ source: z.enum(['file', 'paste']), document: readbackDocumentSchema }).strict(),
  z.object({
    source: z.literal('typed'),
    profileId: z.number({ error: 'Choose the profile' }).int().positive(),
    readAt: z.iso.datetime({ offset: true }).optional(),
    parameters: parameterValues
  }).strict()
], { error: 'The source: file, paste or typed' })
export type ReadbackBody = z.output<typeof readbackBodySchema>

// A setting that differs, with its title and both values in words for the screens and the drift mail.
export interface ReadbackDifference { parameter: string, expected: unknown, found: unknown, label: string, expectedWords: string, foundWords: string }

export interface ReadbackView {
  id: number
  createdAt: string
  readAt: string | null
  source: ReadbackSource
  matches: boolean
  differences: ReadbackDifference[]
  profile: { id: number, name: string }
  versionId: number | null
  versionNo: number | null
  recordedBy: { id: number, name: string } | null
  controller: { serial?: string, firmware?: string }
}

export interface OnCarProfile { profileId: number, name: string, versionId: number, versionNo: number, origin: string, parameters: SettingValues }
