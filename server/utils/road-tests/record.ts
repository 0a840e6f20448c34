// Recording and reading road tests of approved versions (docs/architecture.md#road-test).
import { Op, type Transaction } from 'sequelize'
import { Attachment, Platform, Profile, ProfileVersion, RoadTest, Snag, TelemetryLog, User, Vehicle } from '../../models'
import type { RoadTestCheck } from '../../models/road-test'
import type { SignedIn } from '../guards/guards'
import { isStaff } from '../../../shared/schemas/roles'
import type { RoadTestCreate } from '../../../shared/schemas/road-test'
import { preDriveRecord } from '../../../shared/schemas/road-test-cautions'
import type { AttachmentView, RoadTestListItem, RoadTestView } from '../../../shared/schemas/road-test-views'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { checksFor, recordedCheck } from '../workshop/checks'
import { requireExtraChecks } from './extra-checks'
import { requireTransition } from '../versions/views'

export interface TestedVersion { version: ProfileVersion, profile: Profile, vehicle: Vehicle }

const notFound = (what: string) => createError({ statusCode: 404, message: `No such ${what} in this workshop.` })

// A version of the signed-in person's workshop with its profile and car; road tests are for staff only.
export async function findTestedVersion(user: SignedIn, versionId: number, transaction?: Transaction): Promise<TestedVersion> {
  if (!isStaff(user.roles)) throw notFound('version')
  const version = await ProfileVersion.findOne({ where: { id: versionId, workshopId: user.workshopId }, transaction })
  if (!version) throw notFound('version')
  const profile = await Profile.findByPk(version.profileId, { transaction })
  // A kit's baseline has no car: it is never road-tested itself, its cars are.
  if (!profile?.vehicleId) throw createError({ statusCode: 409, message: 'This is a kit baseline version; road tests are of the cars built from the kit.' })
  const vehicle = await Vehicle.findOne({ where: { id: profile.vehicleId, workshopId: user.workshopId }, include: [{ model: Platform, as: 'platform' }], transaction })
  if (!vehicle) throw notFound('version')
  return { version, profile, vehicle }
}

// A road test's date lies between the version's approval and now; a phone's clock may run a little ahead of
// the server's, so "now" has two minutes' room (docs/version-lifecycle.md).
export const CLOCK_SKEW_MS = 2 * 60_000
const minute = (d: Date) => d.toISOString().slice(0, 16).replace('T', ' ')

export function requireTestedAtInRange(version: ProfileVersion, testedAt: Date, now = new Date()) {
  const field = (message: string) => createError({ statusCode: 400, message, data: { fields: [{ path: 'testedAt', message }] } })
  if (testedAt.getTime() > now.getTime() + CLOCK_SKEW_MS) throw field(`The road test's date (${minute(testedAt)} UTC) is in the future.`)
  if (version.decidedAt && testedAt.getTime() < new Date(version.decidedAt).getTime()) {
    throw field(`The road test's date (${minute(testedAt)} UTC) is before version ${version.versionNo} was approved (${minute(new Date(version.decidedAt))} UTC); only an approved version can be road-tested.`)
  }
}

export const carLabel = (v: Pick<Vehicle, 'stockRef' | 'year' | 'make' | 'model'>) => `${v.stockRef} ${v.year} ${v.make} ${v.model}`

// The record a send with this key made already, if any: a repeated send answers with it (`repeated`).
async function alreadySent(user: SignedIn, versionId: number, key: string | undefined) {
  if (!key) return null
  const rt = await RoadTest.findOne({ where: { workshopId: user.workshopId, idempotencyKey: key } })
  if (rt && rt.versionId !== versionId) throw createError({ statusCode: 409, message: 'This send key belongs to a road test of another version.' })
  return rt
}

export async function recordRoadTest(user: SignedIn, versionId: number, input: RoadTestCreate): Promise<RoadTestView & { repeated: boolean }> {
  const earlier = await alreadySent(user, versionId, input.idempotencyKey)
  if (earlier) return { ...await readRoadTest(user, earlier.id), repeated: true }
  const { version, vehicle } = await findTestedVersion(user, versionId)
  requireTransition(version, 'road-test', user)
  const testedAt = input.testedAt ?? new Date()
  requireTestedAtInRange(version, testedAt)
  const defs = await checksFor(user.workshopId, vehicle.platform?.key ?? null)
  requireExtraChecks(defs, input.checks)
  let repeated = false
  const preDrive = preDriveRecord()
  const id = await useDatabase().transaction(async (transaction) => {
    const rt = await RoadTest.create({
      workshopId: user.workshopId, vehicleId: vehicle.id, versionId: version.id, testerId: user.id, idempotencyKey: input.idempotencyKey ?? null,
      testedAt, conditions: input.conditions, checks: input.checks as RoadTestCheck[], verdict: input.verdict,
      checkList: defs.map(recordedCheck), preDrive
    }, { transaction })
    // A car on its first road test has moved on from the workshop floor.
    if (vehicle.status === 'intake' || vehicle.status === 'converting') {
      await Vehicle.update({ status: 'road-testing' }, { where: { id: vehicle.id }, transaction })
      await appendAuditEvent(transaction, { workshopId: user.workshopId, vehicleId: vehicle.id, actorId: user.id, action: 'vehicle.status-changed', entityType: 'vehicle', entityId: vehicle.id, data: { from: vehicle.status, to: 'road-testing', because: `road test ${rt.id}` } })
    }
    await appendAuditEvent(transaction, {
      workshopId: user.workshopId, vehicleId: vehicle.id, actorId: user.id, action: 'road-test.recorded', entityType: 'road-test', entityId: rt.id,
      data: { versionId: version.id, versionNo: version.versionNo, verdict: input.verdict, conditions: input.conditions, checks: input.checks.map(c => ({ key: c.key, verdict: c.verdict, values: c.values })), preDrive }
    })
    return rt.id
  }).catch(async (e: Error) => {
    // Two sends with one key at once: the unique index lets one through; the other answers with its record.
    const raced = e.name === 'SequelizeUniqueConstraintError' ? await alreadySent(user, versionId, input.idempotencyKey) : null
    if (!raced) throw e
    repeated = true
    return raced.id
  })
  return { ...await readRoadTest(user, id), repeated }
}

// A road test of the signed-in person's workshop (staff only); 404 otherwise.
export async function findRoadTest(user: SignedIn, id: number, transaction?: Transaction, lock = false): Promise<RoadTest> {
  if (!isStaff(user.roles)) throw notFound('road test')
  const rt = await RoadTest.findOne({ where: { id, workshopId: user.workshopId }, transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) })
  if (!rt) throw notFound('road test')
  return rt
}

export function attachmentView(a: Attachment): AttachmentView {
  return { id: a.id, filename: a.filename, contentType: a.contentType, bytes: Number(a.bytes), sha256: a.sha256, caption: a.caption, hasThumbnail: Boolean(a.thumbnailKey), createdAt: new Date(a.createdAt).toISOString() }
}

export async function readRoadTest(user: SignedIn, id: number): Promise<RoadTestView> {
  const rt = await findRoadTest(user, id)
  const [version, vehicle, tester, logs, photos, roadside, snags] = await Promise.all([
    ProfileVersion.findByPk(rt.versionId, { include: [{ model: Profile, as: 'profile' }] }),
    Vehicle.findByPk(rt.vehicleId),
    User.findByPk(rt.testerId, { attributes: ['id', 'name'] }),
    TelemetryLog.findAll({ where: { roadTestId: rt.id }, order: [['id', 'ASC']] }),
    Attachment.findAll({ where: { ownerType: 'road-test', ownerId: rt.id, workshopId: user.workshopId }, order: [['id', 'ASC']] }),
    ProfileVersion.findAll({ where: { roadTestId: rt.id }, attributes: ['id', 'versionNo', 'state'], order: [['versionNo', 'ASC']] }),
    Snag.findAll({ where: { roadTestId: rt.id, workshopId: user.workshopId }, attributes: ['id', 'title', 'kind', 'status', 'blocking'], order: [['id', 'ASC']] })
  ])
  const files = await Attachment.findAll({ where: { id: { [Op.in]: logs.map(l => l.attachmentId) } } })
  return {
    id: rt.id, vehicleId: rt.vehicleId,
    version: { id: version!.id, versionNo: version!.versionNo, state: version!.state, profileId: version!.profileId, profileName: version!.profile?.name ?? '', authorId: version!.authorId, contentHash: version!.contentHash },
    vehicle: { id: vehicle!.id, stockRef: vehicle!.stockRef, make: vehicle!.make, model: vehicle!.model, year: vehicle!.year, status: vehicle!.status },
    tester: { id: tester?.id ?? rt.testerId, name: tester?.name ?? '' },
    testedAt: new Date(rt.testedAt).toISOString(), conditions: rt.conditions, checks: rt.checks as RoadTestView['checks'],
    checkList: rt.checkList ?? [], verdict: rt.verdict, preDrive: rt.preDrive ?? null, signed: rt.signed ?? null,
    telemetry: logs.map(l => ({ id: l.id, attachment: attachmentView(files.find(f => f.id === l.attachmentId)!), summary: l.summary as never, createdAt: new Date(l.createdAt).toISOString() })),
    photos: photos.map(attachmentView),
    roadsideVersions: roadside.map(v => ({ id: v.id, versionNo: v.versionNo, state: v.state })),
    snags: snags.map(n => ({ id: n.id, title: n.title, kind: n.kind, status: n.status, blocking: n.blocking }))
  }
}

export async function listVehicleRoadTests(vehicle: Vehicle): Promise<{ items: RoadTestListItem[], total: number }> {
  const rows = await RoadTest.findAll({
    where: { vehicleId: vehicle.id, workshopId: vehicle.workshopId }, order: [['testedAt', 'DESC'], ['id', 'DESC']],
    include: [{ model: User, as: 'tester', attributes: ['id', 'name'] }, { model: ProfileVersion, as: 'version', attributes: ['id', 'versionNo', 'profileId'], include: [{ model: Profile, as: 'profile', attributes: ['name'] }] }]
  })
  const items = rows.map((rt) => {
    const r = rt as RoadTest & { tester?: User, version?: ProfileVersion }
    return {
      id: rt.id, testedAt: new Date(rt.testedAt).toISOString(), verdict: rt.verdict, signed: Boolean(rt.signed), testerName: r.tester?.name ?? '',
      versionId: rt.versionId, versionNo: r.version?.versionNo ?? 0, profileName: r.version?.profile?.name ?? '',
      failedChecks: rt.checks.filter(c => c.verdict === 'fail').map(c => rt.checkList?.find(d => d.key === c.key)?.label ?? c.key)
    }
  })
  return { items, total: items.length }
}
