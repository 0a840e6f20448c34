import { Op, type Transaction } from 'sequelize'
import { Platform, Profile, ProfileVersion, Readback, User, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { OnCarProfile, ReadbackBody, ReadbackDifference, ReadbackView } from '../../../shared/schemas/readback'
import { compareReadback, withWords } from '../../../shared/utils/readback-compare'
import { schemaProperties } from '../../../shared/compute/parameter-input'
import { requireKnownSettings } from '../platforms/settings-check'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { queueMail, peopleWithRole, absoluteUrl } from '../mail/outbox'

// The profiles whose signed-off version is on the car: what a read-back is compared with.
export async function onCarProfiles(vehicleId: number): Promise<OnCarProfile[]> {
  const profiles = await Profile.findAll({ where: { vehicleId, onCarVersionId: { [Op.ne]: null } }, order: [['name', 'ASC']] })
  const versions = await ProfileVersion.findAll({ where: { id: profiles.map(p => p.onCarVersionId!) } })
  return profiles.flatMap((p) => {
    const v = versions.find(x => x.id === p.onCarVersionId)
    return v ? [{ profileId: p.id, name: p.name, versionId: v.id, versionNo: v.versionNo, origin: v.origin, parameters: v.parameters }] : []
  })
}

function readbackView(r: Readback, profile: { id: number, name: string }, versionNo: number | null, schema?: unknown): ReadbackView {
  return {
    id: r.id, createdAt: r.createdAt.toISOString(), readAt: r.readAt ? r.readAt.toISOString() : null, source: r.source, matches: r.matches,
    differences: r.differences.map(d => withWords(d, schemaProperties(schema))), profile, versionId: r.versionId, versionNo,
    recordedBy: r.recordedBy ? { id: r.recordedBy.id, name: r.recordedBy.name } : null, controller: r.controller
  }
}

export async function listReadbacks(vehicle: Vehicle, limit = 20) {
  const rows = await Readback.findAll({ where: { vehicleId: vehicle.id }, include: [{ model: User, as: 'recordedBy', attributes: ['id', 'name'] }, { model: Profile, as: 'profile', attributes: ['id', 'name'] }, { model: ProfileVersion, as: 'version', attributes: ['id', 'versionNo'] }], order: [['id', 'DESC']], limit })
  return {
    items: rows.map(r => readbackView(r, { id: r.profileId, name: r.profile?.name ?? '' }, r.version?.versionNo ?? null, vehicle.platform?.schema)),
    onCar: await onCarProfiles(vehicle.id),
    driftedAt: vehicle.driftedAt ? vehicle.driftedAt.toISOString() : null
  }
}

const fieldError = (statusCode: number, path: string, message: string) =>
  createError({ statusCode, message, data: { fields: [{ path, message }] } })

async function profileFor(vehicle: Vehicle, body: ReadbackBody) {
  const where = body.source === 'typed' ? { vehicleId: vehicle.id, id: body.profileId } : { vehicleId: vehicle.id, name: body.document.profile }
  const profile = await Profile.findOne({ where })
  const path = body.source === 'typed' ? 'profileId' : 'document.profile'
  if (!profile) throw fieldError(404, path, body.source === 'typed' ? 'No such profile on this car.' : `This car has no profile called "${body.document.profile}".`)
  const version = profile.onCarVersionId ? await ProfileVersion.findByPk(profile.onCarVersionId) : null
  if (!version) throw fieldError(409, path, `Profile "${profile.name}" has no signed-off version on the car yet, so there is nothing to compare with.`)
  return { profile, version }
}

// Every setting read must be one the drive unit has, and of its kind (a number for a number, and so on);
// a value outside the range is what the controller holds, so it is recorded and shows as a difference.
function checkParameters(vehicle: Vehicle, found: Record<string, unknown>, prefix: string) {
  requireKnownSettings(vehicle.platform, found, { prefix })
  return schemaProperties(vehicle.platform?.schema)
}


function driftMail(vehicle: Vehicle, profileName: string, versionNo: number, differences: ReadbackDifference[], by: SignedIn) {
  const lines = differences.map(d => `  ${d.label}: signed off ${d.expectedWords}, the controller holds ${d.foundWords}`)
  return {
    subject: `Drift on ${vehicle.stockRef}: the controller no longer holds what was signed off`,
    text: [`${by.name} read back the controller of ${vehicle.stockRef} ${vehicle.make} ${vehicle.model}. Profile "${profileName}" differs from its signed-off version ${versionNo}:`, '',
      ...lines, '', 'The car stays flagged as drifted until a later read-back matches, or the difference is recorded as a roadside version and signed off.',
      'Until then, treat the car\'s behaviour as unproven; check it with a qualified engineer before it is driven.', '', `Open the car: ${absoluteUrl(`/cars/${vehicle.id}`)}`].join('\n')
  }
}

// Records a read-back, compares it with the on-car version and flags or clears the car's drift, all in one change.
export async function recordReadback(user: SignedIn, vehicle: Vehicle, body: ReadbackBody): Promise<ReadbackView> {
  if (body.source !== 'typed' && body.document.vehicle.toLowerCase() !== vehicle.stockRef.toLowerCase()) {
    throw fieldError(400, 'document.vehicle', `This read-back is of car ${body.document.vehicle}, not ${vehicle.stockRef}.`)
  }
  const found = body.source === 'typed' ? body.parameters : body.document.parameters
  const props = checkParameters(vehicle, found, body.source === 'typed' ? 'parameters' : 'document.parameters')
  const { profile, version } = await profileFor(vehicle, body)
  const differences = compareReadback(version.parameters, found, props)
  const matches = differences.length === 0
  const readAt = body.source === 'typed' ? body.readAt : body.document.readAt
  const controller = body.source === 'typed' ? {} : body.document.controller ?? {}
  return useDatabase().transaction(async (t) => {
    const car = (await Vehicle.findByPk(vehicle.id, { transaction: t, lock: t.LOCK.UPDATE }))!
    const driftedBefore = car.driftedAt ? car.driftedAt.toISOString() : null
    const readback = await Readback.create({ workshopId: vehicle.workshopId, vehicleId: vehicle.id, profileId: profile.id, versionId: version.id, parameters: found, matches, differences, recordedById: user.id, source: body.source, readAt: readAt ? new Date(readAt) : null, controller }, { transaction: t })
    const driftedAfter = matches ? null : (driftedBefore ?? readback.createdAt.toISOString())
    if (driftedAfter !== driftedBefore) await car.update({ driftedAt: driftedAfter ? new Date(driftedAfter) : null }, { transaction: t })
    const patch = driftedAfter === driftedBefore ? [] : [{ op: driftedBefore ? 'replace' : 'add', path: '/driftedAt', value: driftedAfter }]
    await appendAuditEvent(t, {
      workshopId: vehicle.workshopId, vehicleId: vehicle.id, actorId: user.id, action: matches ? 'readback.matched' : 'readback.differs', entityType: 'readback', entityId: readback.id,
      data: { profileId: profile.id, profile: profile.name, versionId: version.id, versionNo: version.versionNo, source: body.source, readAt: readAt ?? null, controller, matches, differences, patch, before: { driftedAt: driftedBefore } }
    })
    if (!matches) {
      const engineers = await peopleWithRole(vehicle.workshopId, 'engineer', t)
      const mail = driftMail(car, profile.name, version.versionNo, differences, user)
      await queueMail(t, engineers.map(e => ({ workshopId: vehicle.workshopId, to: e.email, ...mail })))
    }
    return readbackView(readback, { id: profile.id, name: profile.name }, version.versionNo, vehicle.platform?.schema)
  })
}

// Clears a car's drift flag inside the caller's change. Sign-off of a roadside version must call this: the
// difference the controller held is then recorded, reviewed and proved. Answers whether the car was drifted.
export async function clearDrift(t: Transaction, vehicleId: number, cause: { actorId: number | null, versionId?: number, reason: string }): Promise<boolean> {
  const car = await Vehicle.findByPk(vehicleId, { transaction: t, lock: t.LOCK.UPDATE })
  if (!car?.driftedAt) return false
  const before = car.driftedAt.toISOString()
  await car.update({ driftedAt: null }, { transaction: t })
  await appendAuditEvent(t, {
    workshopId: car.workshopId, vehicleId, actorId: cause.actorId, action: 'vehicle.drift-cleared', entityType: 'vehicle', entityId: vehicleId,
    data: { reason: cause.reason, versionId: cause.versionId ?? null, patch: [{ op: 'replace', path: '/driftedAt', value: null }], before: { driftedAt: before } }
  })
  return true
}

// Drifted cars of the workshop, longest-drifted first, each with the read-back that found it.
export async function listDriftedCars(workshopId: number) {
  const cars = await Vehicle.findAll({ where: { workshopId, driftedAt: { [Op.ne]: null } }, include: [{ model: Platform, as: 'platform', attributes: ['schema'] }], order: [['driftedAt', 'ASC'], ['id', 'ASC']] })
  const latest = await Promise.all(cars.map(c => Readback.findOne({ where: { vehicleId: c.id, matches: false }, order: [['id', 'DESC']] })))
  return {
    items: cars.map((c, i) => ({
      id: c.id, stockRef: c.stockRef, make: c.make, model: c.model, driftedAt: c.driftedAt!.toISOString(),
      differences: (latest[i]?.differences ?? []).map(d => withWords(d, schemaProperties(c.platform?.schema)))
    })),
    total: cars.length
  }
}
