import type { H3Event } from 'h3'
import { z } from 'zod'
import { Vehicle } from '../../models'
import { isStaff, roleLabels, type Role } from '../../../shared/schemas/roles'
import { can, rolesFor, type Permission } from '../../../shared/utils/permissions'
import { selectRows } from '../database/db'

export interface SignedIn { id: number, workshopId: number, email: string, name: string, roles: Role[] }

// The session says who signed in; the database says whether they still may: deactivation, a password change
// (both raise the person's session epoch) and signing out take effect at once, for every copy of the cookie.
export async function requireUser(event: H3Event): Promise<SignedIn> {
  if (event.context.signedIn) return event.context.signedIn as SignedIn
  await checkSignedIn(event)
  return event.context.signedIn as SignedIn
}

// One plain query: this runs on every request. `also` adds columns read in the same round trip.
async function checkSignedIn<X extends object>(event: H3Event, also = '', replacements: Record<string, unknown> = {}): Promise<SignedIn & X> {
  const session = await getUserSession(event)
  const id = session.user?.id
  if (!id) throw createError({ statusCode: 401, message: 'Please sign in.' })
  const [user] = await selectRows<SignedIn & X & { active: boolean, revoked: boolean, sessionEpoch: number }>(
    `SELECT id, "workshopId", email, name, roles, active, "sessionEpoch", EXISTS (SELECT 1 FROM revoked_sessions WHERE "sessionId" = :sessionId) AS revoked${also}
       FROM users WHERE id = :id`, { ...replacements, id, sessionId: session.id ?? '' })
  if (!user || !user.active || user.revoked || user.sessionEpoch !== (session.secure?.sessionEpoch ?? 0)) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, message: 'Please sign in.' })
  }
  event.context.signedIn = { id: user.id, workshopId: user.workshopId, email: user.email, name: user.name, roles: user.roles } satisfies SignedIn
  return user
}

// The permissions map (shared/utils/permissions.ts) says which roles may; this refuses everyone else.
export async function requirePermission(event: H3Event, permission: Permission): Promise<SignedIn> {
  const user = await requireUser(event)
  assertPermission(user, permission)
  return user
}

function assertPermission(user: SignedIn, permission: Permission) {
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
  const inScope = async (user: SignedIn) => (await selectRows(`SELECT 1 FROM vehicles v WHERE v.id = :carId AND ${vehicleScopeSql(user, 'v')}`,
    { carId: id, workshopId: user.workshopId, userId: user.id })).length > 0
  const before = (await getUserSession(event)).user as Partial<SignedIn> | undefined
  let found: boolean
  if (!event.context.signedIn && typeof before?.workshopId === 'number' && Array.isArray(before.roles)) {
    const asSignedIn = before as SignedIn
    const row = await checkSignedIn<{ carFound: boolean }>(event, `, EXISTS (SELECT 1 FROM vehicles v WHERE v.id = :carId AND ${vehicleScopeSql(asSignedIn, 'v')}) AS "carFound"`,
      { carId: id, workshopId: asSignedIn.workshopId, userId: asSignedIn.id })
    const same = row.workshopId === asSignedIn.workshopId && isStaff(row.roles) === isStaff(asSignedIn.roles)
    found = same ? row.carFound : await inScope(row)
  } else {
    found = await inScope(await requireUser(event))
  }
  const user = event.context.signedIn as SignedIn
  if (!found) throw createError({ statusCode: 404, message: 'No such car in this workshop.' })
  if (permission) assertPermission(user, permission)
  return user
}
