import type { H3Event } from 'h3'
import { Platform, User, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { VehicleCreate, VehicleListQuery, VehicleUpdate, VehicleView } from '../../../shared/schemas/vehicle'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { selectRows, useDatabase } from '../database/db'
import { vehicleScopeSql } from '../guards/guards'
import { signedInRead } from '../guards/signed-in'
import { appendAuditEvent } from '../history/audit'
import { findWorkshopPlatform } from '../platforms/platforms'

export function vehicleView(v: Vehicle): VehicleView {
  return {
    id: v.id, stockRef: v.stockRef, make: v.make, model: v.model, year: v.year,
    chassisNumber: v.chassisNumber, registration: v.registration, status: v.status, spec: v.spec,
    ownerUserId: v.ownerUserId, owner: v.owner ? { id: v.owner.id, name: v.owner.name } : null,
    platform: v.platform ? { key: v.platform.key, name: v.platform.name } : null,
    kitId: v.kitId ?? null,
    driftedAt: v.driftedAt ?? null,
    createdAt: v.createdAt, updatedAt: v.updatedAt
  }
}

export const vehicleInclude = [{ model: Platform, as: 'platform' }, { model: User, as: 'owner', attributes: ['id', 'name'] }]

// One plain query for the page and its count (the list is the busiest read): of the drive unit only what the
// list shows, not its schema. Sort fields come from the schema's own list, so they are safe to name in SQL.
export async function listVehicles(event: H3Event, q: VehicleListQuery) {
  const order = (t: string) => `${t}."${q.sort}" ${q.dir === 'desc' ? 'DESC' : 'ASC'}, ${t}.id ASC`
  const filter = (user: SignedIn) => {
    const where = [vehicleScopeSql(user, 'v')]
    const replacements: Record<string, unknown> = { workshopId: user.workshopId, userId: user.id }
    if (q.status) { where.push('v.status = :status'); replacements.status = q.status }
    if (q.q) {
      where.push(`(${['make', 'model', '"stockRef"', 'registration'].map(f => `v.${f} ILIKE :like`).join(' OR ')})`)
      replacements.like = `%${q.q.replace(/[\\%_]/g, m => `\\${m}`)}%`
    }
    return { where: where.join(' AND '), replacements }
  }
  // The page and the person's sign-in check in one round trip (guards/signed-in.ts).
  const { user, rows } = await signedInRead<ListRow>(event, (u) => {
    const { where, replacements } = filter(u)
    return {
      sql: `SELECT v.*, pl.key AS "platformKey", pl.name AS "platformName", o.name AS "ownerName", count(*) OVER () AS total
              FROM vehicles v LEFT JOIN platforms pl ON pl.id = v."platformId" LEFT JOIN users o ON o.id = v."ownerUserId"
             WHERE ${where} ORDER BY ${order('v')} LIMIT :limit OFFSET :offset`,
      replacements: { ...replacements, limit: q.pageSize, offset: (q.page - 1) * q.pageSize },
      orderBy: order('r')
    }
  })
  const total = rows.length ? Number(rows[0]!.total) : q.page === 1 ? 0 : await countVehicles(filter(user))
  const items = rows.map(r => vehicleView({
    ...r, platform: r.platformKey ? { key: r.platformKey, name: r.platformName } : undefined,
    owner: r.ownerUserId ? { id: r.ownerUserId, name: r.ownerName } : undefined
  } as unknown as Vehicle))
  return { items, total }
}

type ListRow = Vehicle & { platformKey: string | null, platformName: string, ownerName: string, total: string }

// A page past the end still reports how many cars there are.
async function countVehicles({ where, replacements }: { where: string, replacements: Record<string, unknown> }) {
  const [row] = await selectRows<{ n: string }>(`SELECT count(*) AS n FROM vehicles v WHERE ${where}`, replacements)
  return Number(row!.n)
}

async function platformFor(key: string, workshopId: number) {
  const platform = await findWorkshopPlatform(key, workshopId)
  if (!platform) throw createError({ statusCode: 400, message: `Unknown drive unit "${key}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  return platform
}

export async function assertOwner(ownerUserId: number | null | undefined, workshopId: number) {
  if (!ownerUserId) return
  const owner = await User.findOne({ where: { id: ownerUserId, workshopId } })
  if (!owner || !owner.roles.includes('client')) {
    throw createError({ statusCode: 400, message: 'The owner must be a car owner of this workshop.', data: { fields: [{ path: 'ownerUserId', message: 'Not a car owner of this workshop' }] } })
  }
}

export function duplicateRef(e: unknown): never {
  if ((e as { name?: string }).name === 'SequelizeUniqueConstraintError') {
    throw createError({ statusCode: 409, message: 'Another car already has this stock ref.', data: { fields: [{ path: 'stockRef', message: 'Already used' }] } })
  }
  throw e
}

export async function createVehicle(user: SignedIn, input: VehicleCreate) {
  const { platformKey, ...fields } = input
  const platform = await platformFor(platformKey, user.workshopId)
  await assertOwner(fields.ownerUserId, user.workshopId)
  const id = await useDatabase().transaction(async (transaction) => {
    const v = await Vehicle.create({ ...fields, workshopId: user.workshopId, platformId: platform.id }, { transaction }).catch(duplicateRef)
    await appendAuditEvent(transaction, { workshopId: user.workshopId, vehicleId: v.id, actorId: user.id, action: 'vehicle.created', entityType: 'vehicle', entityId: v.id, data: { after: { ...fields, platformKey } } })
    return v.id
  })
  return vehicleView((await Vehicle.findByPk(id, { include: vehicleInclude }))!)
}

function editable(v: Vehicle) {
  return { stockRef: v.stockRef, make: v.make, model: v.model, year: v.year, chassisNumber: v.chassisNumber, registration: v.registration, ownerUserId: v.ownerUserId, status: v.status, platformKey: v.platform?.key, spec: v.spec }
}

export async function updateVehicle(user: SignedIn, vehicle: Vehicle, input: VehicleUpdate) {
  const { platformKey, ...fields } = input
  const platform = platformKey ? await platformFor(platformKey, user.workshopId) : undefined
  await assertOwner(fields.ownerUserId, user.workshopId)
  const before = editable(vehicle)
  await useDatabase().transaction(async (transaction) => {
    const locked = await Vehicle.findByPk(vehicle.id, { transaction, lock: transaction.LOCK.UPDATE })
    await locked!.update({ ...fields, ...(platform ? { platformId: platform.id } : {}) }, { transaction }).catch(duplicateRef)
    const after = { ...before, ...fields, ...(platformKey ? { platformKey } : {}) }
    const patch = jsonPatch(before, after)
    if (patch.length) {
      await appendAuditEvent(transaction, { workshopId: user.workshopId, vehicleId: vehicle.id, actorId: user.id, action: 'vehicle.updated', entityType: 'vehicle', entityId: vehicle.id, data: { patch } })
    }
  })
  return vehicleView((await Vehicle.findByPk(vehicle.id, { include: vehicleInclude }))!)
}
