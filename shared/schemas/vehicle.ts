import { z } from 'zod'
import { vehicleSpecSchema } from './vehicle-spec'

export const vehicleStatuses = ['intake', 'converting', 'road-testing', 'snagging', 'handed-over'] as const
export type VehicleStatus = typeof vehicleStatuses[number]
export const vehicleStatusLabels: Record<VehicleStatus, string> = {
  'intake': 'Intake',
  'converting': 'Converting',
  'road-testing': 'Road testing',
  'snagging': 'Snagging',
  'handed-over': 'Handed over'
}

const text = (label: string, max = 80) => z.string({ error: `${label} is needed` }).trim().min(1, `${label} is needed`).max(max, `${label}: at most ${max} characters`)

const vehicleFields = {
  stockRef: text('Stock ref', 20),
  make: text('Make'),
  model: text('Model'),
  year: z.number({ error: 'A year is needed' }).int('A whole year').min(1885, 'Not before 1885').max(2100, 'Not after 2100'),
  chassisNumber: z.string().trim().max(40),
  registration: z.string().trim().max(20),
  ownerUserId: z.number().int().positive().nullable(),
  status: z.enum(vehicleStatuses),
  platformKey: text('Drive unit', 60),
  spec: vehicleSpecSchema
}

// Booking in: the optional facts start empty. An edit changes only the fields it sends (no defaults).
export const vehicleCreateSchema = z.object({
  ...vehicleFields,
  chassisNumber: vehicleFields.chassisNumber.default(''),
  registration: vehicleFields.registration.default(''),
  ownerUserId: vehicleFields.ownerUserId.default(null),
  status: vehicleFields.status.default('intake')
}).strict()
// Booking in from a kit: the drive unit is the kit's and the spec its template, with any facts given here
// laid over it (checked whole once merged).
export const vehicleFromKitSchema = z.object({
  ...vehicleFields,
  kitId: z.number().int().positive().max(2147483647),
  chassisNumber: vehicleFields.chassisNumber.default(''),
  registration: vehicleFields.registration.default(''),
  ownerUserId: vehicleFields.ownerUserId.default(null),
  status: vehicleFields.status.default('intake'),
  profileName: z.string().trim().min(1, 'A name is needed').max(40, 'At most 40 characters').default('Road'),
  spec: z.record(z.string().max(40), z.unknown()).refine(s => Object.keys(s).length <= 40, 'Too many fields').default({})
}).omit({ platformKey: true }).strict()
export type VehicleFromKit = z.output<typeof vehicleFromKitSchema>

export const vehicleUpdateSchema = z.object(vehicleFields).partial().strict()

export type VehicleCreate = z.output<typeof vehicleCreateSchema>
export type VehicleUpdate = z.output<typeof vehicleUpdateSchema>

export const vehicleSortFields = ['stockRef', 'make', 'model', 'year', 'status', 'updatedAt'] as const
export const vehicleListQuerySchema = z.object({
  q: z.string().trim().max(80).optional(),
  status: z.enum(vehicleStatuses).optional(),
  sort: z.enum(vehicleSortFields).default('stockRef'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).max(10000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20)
})
export type VehicleListQuery = z.output<typeof vehicleListQuerySchema>

// A car as the API answers it.
export interface VehicleView {
  id: number
  stockRef: string
  make: string
  model: string
  year: number
  chassisNumber: string
  registration: string
  status: VehicleStatus
  spec: z.output<typeof vehicleSpecSchema>
  ownerUserId: number | null
  owner: { id: number, name: string } | null
  platform: { key: string, name: string } | null
  kitId: number | null
  driftedAt: Date | string | null
  createdAt: Date | string
  updatedAt: Date | string
}
