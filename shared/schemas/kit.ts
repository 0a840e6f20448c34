import type { SettingValue } from '../compute/setting-kinds'
import { z } from 'zod'
import { vehicleSpecSchema } from './vehicle-spec'
import { parametersSchema } from './profile'
import type { VersionSummary } from './profile-views'
import { PARAMETER_NAMES } from '../compute/parameters'

const text = (label: string, max = 80) => z.string({ error: `${label} is needed` }).trim().min(1, `${label} is needed`).max(max, `${label}: at most ${max} characters`)
const year = z.number({ error: 'A year is needed' }).int('A whole year').min(1885, 'Not before 1885').max(2100, 'Not after 2100')

// One line of the cars a kit bolts into: a make and model over a span of years.
export const kitFitSchema = z.object({ make: text('Make'), model: text('Model'), yearFrom: year, yearTo: year }).strict()
  .refine(f => f.yearFrom <= f.yearTo, { message: 'The first year comes before the last', path: ['yearTo'] })
export type KitFit = z.output<typeof kitFitSchema>

// "Velling Arden Estate (1967–1978); Penhallow Marten Roadster (1962)"
export const fitsText = (fits: KitFit[]) => fits.map(f => `${f.make} ${f.model} (${f.yearFrom === f.yearTo ? f.yearFrom : `${f.yearFrom}–${f.yearTo}`})`).join('; ')

const kitFields = {
  name: text('A name'),
  fits: z.array(kitFitSchema).max(50, 'At most 50 lines'),
  specTemplate: vehicleSpecSchema
}

// A new kit starts its baseline with a first draft: the given settings, or the drive unit's defaults.
export const kitCreateSchema = z.object({
  ...kitFields,
  fits: kitFields.fits.default([]),
  platformKey: text('Drive unit', 60),
  parameters: parametersSchema.optional(),
  rationale: z.string().trim().max(4000, 'At most 4000 characters').default('')
}).strict()
export type KitCreate = z.output<typeof kitCreateSchema>

// The drive unit is fixed once a baseline exists (its settings belong to that unit).
export const kitUpdateSchema = z.object(kitFields).partial().strict()
export type KitUpdate = z.output<typeof kitUpdateSchema>

export interface KitSummary {
  id: number
  name: string
  platform: { key: string, name: string }
  fits: KitFit[]
  baselineProfileId: number | null
  latestApproved: { id: number, versionNo: number } | null
  carCount: number
}

export interface KitView extends KitSummary {
  specTemplate: z.output<typeof vehicleSpecSchema>
  versions: VersionSummary[]
  cars: { id: number, stockRef: string, make: string, model: string, year: number, status: string, onLatest: boolean }[]
}

// Rebasing a car profile onto the kit's newer baseline: the tuner's choice for each setting both changed.
export const rebaseSchema = z.object({
  choices: z.partialRecord(z.enum(PARAMETER_NAMES, { error: 'Not a setting this controller has' }), z.enum(['car', 'kit'], { error: 'Choose the car\'s value or the kit\'s' })).default({}),
  rationale: z.string().trim().max(4000, 'At most 4000 characters').default('')
}).strict()
export type RebaseInput = z.output<typeof rebaseSchema>

export interface RebaseRow { name: string, label: string, unit: string, base: SettingValue | null, car: SettingValue | null, kit: SettingValue | null, merged: SettingValue | null, conflict: boolean, source: 'same' | 'car' | 'kit' | 'both' }
export interface RebasePreview {
  profileId: number
  kit: { id: number, name: string }
  carVersion: { id: number, versionNo: number }
  from: { id: number, versionNo: number }
  to: { id: number, versionNo: number }
  moved: boolean
  rows: RebaseRow[]
  conflicts: string[]
}
