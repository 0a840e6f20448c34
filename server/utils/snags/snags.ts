// The snag list: per car and workshop-wide, every change audited as a JSON Patch.
import { Op, type WhereOptions } from 'sequelize'
import { Attachment, RoadTest, Snag, User, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import { isStaff } from '../../../shared/schemas/roles'
import { rolesFor } from '../../../shared/utils/permissions'
import { unresolvedSnagStatuses, type SnagCreate, type SnagListQuery, type SnagUpdate, type SnagView } from '../../../shared/schemas/snag'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'

const include = [
  { model: User, as: 'assignee', attributes: ['id', 'name'] },
  { model: Vehicle, as: 'vehicle', attributes: ['id', 'stockRef', 'make', 'model'] }
]

type SnagRow = Snag & { assignee?: User | null, vehicle?: Vehicle }

async function views(rows: SnagRow[]): Promise<SnagView[]> {
  const ids = rows.map(s => s.id)
  const [photos, creators] = await Promise.all([
    ids.length ? Attachment.findAll({ where: { ownerType: 'snag', ownerId: ids }, order: [['id', 'ASC']] }) : [],
    User.findAll({ where: { id: [...new Set(rows.map(s => s.createdById))] }, attributes: ['id', 'name'] })
  ])
  return rows.map((s) => {
    const creator = creators.find(u => u.id === s.createdById)
    return {
      id: s.id, vehicleId: s.vehicleId, roadTestId: s.roadTestId ?? null, kind: s.kind, title: s.title, detail: s.detail,
      priority: s.priority, status: s.status, blocking: s.blocking,
      vehicle: s.vehicle ? { id: s.vehicle.id, stockRef: s.vehicle.stockRef, make: s.vehicle.make, model: s.vehicle.model } : undefined,
      assignee: s.assignee ? { id: s.assignee.id, name: s.assignee.name } : null,
      createdBy: creator ? { id: creator.id, name: creator.name } : null,
      photos: photos.filter(p => p.ownerId === s.id).map(p => ({ id: p.id, filename: p.filename, caption: p.caption, bytes: Number(p.bytes), hasThumbnail: Boolean(p.thumbnailKey) })),
      createdAt: new Date(s.createdAt).toISOString(), updatedAt: new Date(s.updatedAt).toISOString()
    }
  })
}

function filters(q: SnagListQuery): Record<string, unknown> {
  const where: Record<string, unknown> = {}
  if (q.kind) where.kind = q.kind
  if (q.status) where.status = q.status === 'unresolved' ? unresolvedSnagStatuses : q.status
  if (q.priority) where.priority = q.priority
  if (q.blocking !== undefined) where.blocking = q.blocking
  if (q.assigneeId) where.assigneeId = q.assigneeId
  return where
}

const priorityOrder = `CASE "Snag"."priority" WHEN 'urgent' THEN 0 WHEN 'high' THEN 1 WHEN 'normal' THEN 2 ELSE 3 END`

export async function listSnags(user: SignedIn, q: SnagListQuery, vehicleId?: number) {
  const where = { workshopId: user.workshopId, ...filters(q), ...(vehicleId ? { vehicleId } : {}) } as WhereOptions<Snag>
  const rows = await Snag.findAll({ where, include, order: [[useDatabase().literal('"Snag"."blocking"'), 'DESC'], [useDatabase().literal(priorityOrder), 'ASC'], ['id', 'ASC']] })
  const items = await views(rows as SnagRow[])
  return { items, total: items.length }
}

async function assertAssignee(user: SignedIn, assigneeId: number | null | undefined) {
  if (!assigneeId) return
  const person = await User.findOne({ where: { id: assigneeId, workshopId: user.workshopId, active: true } })
  if (!person || !isStaff(person.roles)) {
    throw createError({ statusCode: 400, message: 'A snag is assigned to someone on the workshop staff.', data: { fields: [{ path: 'assigneeId', message: 'Not on the workshop staff' }] } })
  }
}

export async function createSnag(user: SignedIn, vehicle: Vehicle, input: SnagCreate) {
  await assertAssignee(user, input.assigneeId)
  if (input.roadTestId && !(await RoadTest.findOne({ where: { id: input.roadTestId, vehicleId: vehicle.id, workshopId: user.workshopId } }))) {
    throw createError({ statusCode: 400, message: 'That road test is not one of this car\'s.', data: { fields: [{ path: 'roadTestId', message: 'Not a road test of this car' }] } })
  }
  const id = await useDatabase().transaction(async (transaction) => {
    const s = await Snag.create({ ...input, workshopId: user.workshopId, vehicleId: vehicle.id, createdById: user.id }, { transaction })
    await appendAuditEvent(transaction, { workshopId: user.workshopId, vehicleId: vehicle.id, actorId: user.id, action: 'snag.created', entityType: 'snag', entityId: s.id, data: { after: input } })
    return s.id
  })
  return readSnag(user, id)
}

export async function findSnag(user: SignedIn, id: number): Promise<Snag> {
  const snag = isStaff(user.roles) ? await Snag.findOne({ where: { id, workshopId: user.workshopId } }) : null
  if (!snag) throw createError({ statusCode: 404, message: 'No such snag in this workshop.' })
  return snag
}

export async function readSnag(user: SignedIn, id: number): Promise<SnagView> {
  const row = await Snag.findOne({ where: { id, workshopId: user.workshopId }, include })
  if (!row) throw createError({ statusCode: 404, message: 'No such snag in this workshop.' })
  return (await views([row as SnagRow]))[0]!
}

const editable = (s: Snag) => ({ kind: s.kind, title: s.title, detail: s.detail, priority: s.priority, status: s.status, assigneeId: s.assigneeId ?? null, blocking: s.blocking })

export async function updateSnag(user: SignedIn, id: number, input: SnagUpdate) {
  await findSnag(user, id)
  await assertAssignee(user, input.assigneeId)
  await useDatabase().transaction(async (transaction) => {
    const snag = await Snag.findOne({ where: { id, workshopId: user.workshopId }, lock: transaction.LOCK.UPDATE, transaction })
    const before = editable(snag!)
    await snag!.update(input, { transaction })
    const patch = jsonPatch(before, editable(snag!))
    if (patch.length) await appendAuditEvent(transaction, { workshopId: user.workshopId, vehicleId: snag!.vehicleId, actorId: user.id, action: 'snag.updated', entityType: 'snag', entityId: id, data: { patch } })
  })
  return readSnag(user, id)
}

// People a snag can be given to: the workshop's active staff.
export async function snagAssignees(user: SignedIn) {
  const people = await User.findAll({ where: { workshopId: user.workshopId, active: true, roles: { [Op.overlap]: [...rolesFor('snags.write')] } }, attributes: ['id', 'name', 'roles'], order: [['name', 'ASC']] })
  return { items: people.map(p => ({ id: p.id, name: p.name, roles: p.roles })), total: people.length }
}
