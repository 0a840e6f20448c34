import { Op, type WhereOptions } from 'sequelize'
import { Platform, User, Vehicle } from '../models'
import type { SignedIn } from './guards'
import { isStaff } from '../../shared/schemas/roles'
import type { VehicleCreate, VehicleListQuery, VehicleUpdate, VehicleView } from '../../shared/schemas/vehicle'
import { jsonPatch } from '../../shared/utils/json-patch'

export function vehicleView(v: Vehicle): VehicleView {
  return {
    id: v.id, stockRef: v.stockRef, make: v.make, model: v.model, year: v.year,
    chassisNumber: v.chassisNumber, registration: v.registration, status: v.status, spec: v.spec,
    ownerUserId: v.ownerUserId, owner: v.owner?.id ? { id: v.owner.id, name: v.owner.name } : null,
    platform: v.platform?.key ? { key: v.platform.key, name: v.platform.name } : null,
    driftedAt: v.driftedAt ?? null,
    createdAt: v.createdAt, updatedAt: v.updatedAt
  }
}

const include = [{ model: Platform, as: 'platform' }, { model: User, as: 'owner', attributes: ['id', 'name'] }]
const listInclude = [{ model: Platform, as: 'platform', attributes: ['key', 'name'] }, { model: User, as: 'owner', attributes: ['id', 'name'] }]

export async function listVehicles(user: SignedIn, q: VehicleListQuery) {
  const where: WhereOptions<Vehicle> & Record<string | symbol, unknown> = { workshopId: user.workshopId }
  if (!isStaff(user.roles)) where.ownerUserId = user.id
  if (q.status) where.status = q.status
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, m => `\\${m}`)}%`
    where[Op.or] = ['make', 'model', 'stockRef', 'registration'].map(f => ({ [f]: { [Op.iLike]: like } }))
  }
  // Plain rows, and of the drive unit only what the list shows (not its schema).
  const { rows, count } = await Vehicle.findAndCountAll({
    where, include: listInclude, order: [[q.sort, q.dir.toUpperCase()], ['id', 'ASC']],
    limit: q.pageSize, offset: (q.page - 1) * q.pageSize, raw: true, nest: true
  })
  return { items: (rows as unknown as Vehicle[]).map(vehicleView), total: count }
}

async function platformFor(key: string, workshopId: number) {
  const platform = await Platform.findOne({ where: { key, [Op.or]: [{ workshopId: null }, { workshopId }] } })
  if (!platform) throw createError({ statusCode: 400, message: `Unknown drive unit "${key}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  return platform
}

async function assertOwner(ownerUserId: number | null | undefined, workshopId: number) {
  if (!ownerUserId) return
  const owner = await User.findOne({ where: { id: ownerUserId, workshopId } })
  if (!owner || !owner.roles.includes('client')) {
    throw createError({ statusCode: 400, message: 'The owner must be a car owner of this workshop.', data: { fields: [{ path: 'ownerUserId', message: 'Not a car owner of this workshop' }] } })
  }
}

function duplicateRef(e: unknown): never {
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
  return vehicleView((await Vehicle.findByPk(id, { include }))!)
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
  return vehicleView((await Vehicle.findByPk(vehicle.id, { include }))!)
}
