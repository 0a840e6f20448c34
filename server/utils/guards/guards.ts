import type { H3Event } from 'h3'
import { z } from 'zod'
import { Vehicle } from '../../models'
import { isStaff, roleLabels, type Role } from '../../../shared/schemas/roles'
import { can, rolesFor, type Permission } from '../../../shared/utils/permissions'
import { signedInRead } from './signed-in'

export interface SignedIn { id: number, workshopId: number, email: string, name: string, roles: Role[] }

// Who is signed in, checked against the database (./signed-in.ts).
export async function requireUser(event: H3Event): Promise<SignedIn> {
  return (await signedInRead(event)).user
}

// The permissions map (shared/utils/permissions.ts) says which roles may; this refuses everyone else.
export async function requirePermission(event: H3Event, permission: Permission): Promise<SignedIn> {
  const user = await requireUser(event)
  assertPermission(user, permission)
  return user
}

export function assertPermission(user: SignedIn, permission: Permission) {
  if (can(user.roles, permission)) return
  if (permission === 'staff') throw createError({ statusCode: 403, message: 'Only workshop staff can do this.' })
  const names = rolesFor(permission).map(r => roleLabels[r].toLowerCase())
  throw createError({ statusCode: 403, message: `This needs the role of ${names.join(' or ')}.` })
}

export const idParamSchema = z.object({ id: z.coerce.number().int().positive().max(2147483647) })

// A car of the signed-in person's workshop; a car owner reaches only their own. Anything else is 404.
// With a permission, the car is looked up first (404 hides it from other workshops), then the role is checked.
export async function requireVehicle(event: H3Event, id: number, permission?: Permission): Promise<{ user: SignedIn, vehicle: Vehicle }> {
  const user = await requireUser(event)
  const where: Record<string, unknown> = { id, workshopId: user.workshopId }
  if (!isStaff(user.roles)) where.ownerUserId = user.id
  const vehicle = await Vehicle.findOne({ where, include: ['platform'] })
  if (!vehicle) throw createError({ statusCode: 404, message: 'No such car in this workshop.' })
  if (permission) assertPermission(user, permission)
  return { user, vehicle }
}

// The cars a person may read, as SQL on the vehicles table under `alias` (requireVehicle's scope, for plain
// queries): their workshop's, and for a car owner only their own. Needs :workshopId and :userId replaced.
export function vehicleScopeSql(user: SignedIn, alias: string): string {
  return `${alias}."workshopId" = :workshopId${isStaff(user.roles) ? '' : ` AND ${alias}."ownerUserId" = :userId`}`
}

// The same scope where the route needs only to know the car may be read (one plain query, no model).
// When the person is not yet checked, the car is looked up in the same round trip as the person, scoped as
// the session says they were at sign-in; if the database now says another workshop or staff role, again.
export async function requireVehicleAccess(event: H3Event, id: number, permission?: Permission): Promise<SignedIn> {
  const { user, rows } = await signedInRead(event, u => ({
    sql: `SELECT 1 FROM vehicles v WHERE v.id = :carId AND ${vehicleScopeSql(u, 'v')}`, replacements: { carId: id, workshopId: u.workshopId, userId: u.id }
  }))
  if (!rows.length) throw createError({ statusCode: 404, message: 'No such car in this workshop.' })
  if (permission) assertPermission(user, permission)
  return user
}
