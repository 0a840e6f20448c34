// Sign-off (docs/architecture.md#sign-off): a passing road test by a tester who is not the author makes the version the one on
// the car. One transaction with the profile row locked, so parallel sign-offs leave exactly one on-car version.
import { Op, type Transaction } from 'sequelize'
import { Attachment, Profile, ProfileVersion, RoadTest, Snag, TelemetryLog, User, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import { mandatoryCheckKeys, checkVerdictLabels, type CheckVerdict } from '../../../shared/schemas/road-test'
import { checkTitles } from '../../../shared/schemas/road-test-checks'
import { unresolvedSnagStatuses } from '../../../shared/schemas/snag'
import type { VersionState } from '../../../shared/schemas/version'
import { failedPeopleRules, personRefusal, stateAfter, stateRefusal, versionLifecycle, type PersonRule } from '../../../shared/schemas/version-lifecycle'
import type { VehicleStatus } from '../../../shared/schemas/vehicle'
import { canonicalJson } from '../../../shared/utils/canonical-json'
import { formatDateTime } from '../../../shared/utils/dates'
import { roadTestRecordContent } from '../../../shared/utils/road-test-record'
import { useDatabase } from '../database/db'
import { clearDrift } from '../fleet/readbacks'
import { sha256Hex, appendAuditEvent } from '../history/audit'
import { queueMail, peopleWithRole, absoluteUrl } from '../mail/outbox'
import { carLabel, findRoadTest, readRoadTest } from './record'
import { refreshOnCarEvaluation } from '../fleet/on-car-evaluation'

export interface MissingForSignOff { code: string, message: string, check?: string, snags?: { id: number, title: string }[] }

// What the signature covers: the record as tested, the version's own hash, and every stored file's hash.
export async function roadTestRecordHash(rt: RoadTest, version: ProfileVersion, signedAt: Date, transaction?: Transaction): Promise<string> {
  const logs = await TelemetryLog.findAll({ where: { roadTestId: rt.id }, order: [['id', 'ASC']], transaction })
  const files = await Attachment.findAll({ where: { workshopId: rt.workshopId, [Op.or]: [{ ownerType: 'road-test', ownerId: rt.id }, { id: logs.map(l => l.attachmentId) }] }, order: [['id', 'ASC']], transaction })
  return sha256Hex(canonicalJson(roadTestRecordContent({
    roadTestId: rt.id, vehicleId: rt.vehicleId, versionId: version.id, versionContentHash: version.contentHash, testerId: rt.testerId,
    testedAt: rt.testedAt, conditions: rt.conditions, checks: rt.checks, verdict: rt.verdict, ...(rt.checkList?.length ? { checkList: rt.checkList } : {}), ...(rt.preDrive ? { preDrive: rt.preDrive } : {}),
    telemetry: logs.map(l => ({ summary: l.summary, sha256: files.find(f => f.id === l.attachmentId)?.sha256 ?? null })),
    files: files.map(f => ({ id: f.id, sha256: f.sha256 })), signedAt
  })))
}

const personCodes: Record<PersonRule, string> = { 'driver': 'not-the-tester', 'not-author': 'tester-is-author', 'author': 'not-the-author' }

async function whatIsMissing(user: SignedIn, rt: RoadTest, version: ProfileVersion, transaction: Transaction): Promise<MissingForSignOff[]> {
  const missing: MissingForSignOff[] = []
  if (rt.signed) missing.push({ code: 'already-signed', message: `This road test was already signed off on ${formatDateTime(rt.signed.at, { timeZone: 'UTC' })} UTC.` })
  const notApproved = stateRefusal('sign-off', version.state as VersionState, version.versionNo)
  if (notApproved) missing.push({ code: 'version-not-approved', message: notApproved })
  const failed = failedPeopleRules('sign-off', { roles: user.roles, isAuthor: version.authorId === user.id, isDriver: rt.testerId === user.id })
  for (const rule of failed) missing.push({ code: personCodes[rule], message: personRefusal('sign-off', rule) })
  if (rt.verdict !== 'pass') missing.push({ code: 'verdict-not-pass', message: 'The road test did not pass.' })
  for (const key of mandatoryCheckKeys) {
    const check = rt.checks.find(c => c.key === key)
    if (check?.verdict === 'pass') continue
    const state = !check ? 'missing' : check.verdict === 'fail' ? 'failed' : checkVerdictLabels[check.verdict as CheckVerdict].toLowerCase()
    missing.push({ code: 'check-not-passed', check: key, message: `The ${checkTitles[key].toLowerCase()} check is ${state}.` })
  }
  // Settings changed at the roadside during this drive are what the controller may now hold: the tested
  // version cannot go on the record as the car's until that change is sent back or withdrawn
  // (docs/version-lifecycle.md#roadside-changes).
  const roadside = await ProfileVersion.findAll({ where: { roadTestId: rt.id, origin: 'roadside', state: ['draft', 'in-review', 'approved'] }, attributes: ['versionNo', 'state'], order: [['versionNo', 'ASC']], transaction })
  for (const r of roadside) {
    const what = r.state === 'approved' ? 'was approved: road-test it and sign that off instead' : 'awaits review: the engineer decides it first'
    missing.push({ code: 'roadside-change-open', message: `The change made at the roadside during this drive (v${r.versionNo}) ${what}.` })
  }
  const blocking = await Snag.findAll({ where: { vehicleId: rt.vehicleId, blocking: true, status: unresolvedSnagStatuses }, attributes: ['id', 'title'], order: [['id', 'ASC']], transaction })
  if (blocking.length) {
    missing.push({ code: 'blocking-snags', snags: blocking.map(s => ({ id: s.id, title: s.title })), message: `${blocking.length} blocking snag${blocking.length === 1 ? ' is' : 's are'} still open: ${blocking.map(s => `“${s.title}”`).join(', ')}.` })
  }
  return missing
}

// After sign-off a car with unresolved snags goes to snagging; a car with none is ready and handed over.
export function statusAfterSignOff(unresolvedSnags: number): VehicleStatus {
  return unresolvedSnags > 0 ? 'snagging' : 'handed-over'
}

export async function signOffRoadTest(user: SignedIn, id: number) {
  const first = await findRoadTest(user, id)
  const versionRow = await ProfileVersion.findByPk(first.versionId, { attributes: ['profileId'] })
  const result = await useDatabase().transaction(async (transaction) => {
    const lock = transaction.LOCK.UPDATE
    const profile = await Profile.findOne({ where: { id: versionRow!.profileId, workshopId: user.workshopId }, lock, transaction })
    const rt = await RoadTest.findOne({ where: { id, workshopId: user.workshopId }, lock, transaction })
    const version = await ProfileVersion.findByPk(rt!.versionId, { lock, transaction })
    const vehicle = await Vehicle.findByPk(rt!.vehicleId, { lock, transaction })
    const missing = await whatIsMissing(user, rt!, version!, transaction)
    if (missing.length) throw createError({ statusCode: 409, message: `Cannot sign off yet. ${missing.map(m => m.message).join(' ')}`, data: { missing } })

    const previousId = profile!.onCarVersionId && profile!.onCarVersionId !== version!.id ? profile!.onCarVersionId : null
    const supersede = versionLifecycle.supersede
    if (previousId) await ProfileVersion.update({ state: stateAfter('supersede', supersede.from[0]!) }, { where: { id: previousId, state: supersede.from as VersionState[] }, transaction })
    await version!.update({ state: stateAfter('sign-off', version!.state as VersionState) }, { transaction })
    await profile!.update({ onCarVersionId: version!.id }, { transaction })
    await refreshOnCarEvaluation(transaction, profile!.id)
    const at = new Date()
    const contentHash = await roadTestRecordHash(rt!, version!, at, transaction)
    await rt!.update({ signed: { testerId: user.id, at: at.toISOString(), contentHash } }, { transaction })
    const unresolved = await Snag.count({ where: { vehicleId: vehicle!.id, status: unresolvedSnagStatuses }, transaction })
    const from = vehicle!.status
    const to = statusAfterSignOff(unresolved)
    if (from !== to) await vehicle!.update({ status: to }, { transaction })
    // The car now holds a road-tested, signed-off version, so an earlier read-back difference no longer stands.
    await clearDrift(transaction, vehicle!.id, { actorId: user.id, versionId: version!.id, reason: `${version!.origin === 'roadside' ? 'Roadside' : 'Workshop'} version ${version!.versionNo} of ${profile!.name} signed off after its road test` })
    await appendAuditEvent(transaction, {
      workshopId: user.workshopId, vehicleId: vehicle!.id, actorId: user.id, action: 'version.signed-off', entityType: 'version', entityId: version!.id,
      data: { roadTestId: rt!.id, versionNo: version!.versionNo, profileId: profile!.id, profileName: profile!.name, contentHash, versionContentHash: version!.contentHash, supersededVersionId: previousId, vehicleStatus: { from, to }, unresolvedSnags: unresolved }
    })
    await mailSignOff(transaction, user, vehicle!, profile!, version!, unresolved)
    return { versionId: version!.id, state: 'signed-off' as const, supersededVersionId: previousId, vehicleStatus: to, signed: rt!.signed! }
  })
  return { ...result, roadTest: await readRoadTest(user, id) }
}

async function mailSignOff(transaction: Transaction, tester: SignedIn, vehicle: Vehicle, profile: Profile, version: ProfileVersion, unresolved: number) {
  const engineers = await peopleWithRole(tester.workshopId, 'engineer', transaction)
  const owner = vehicle.ownerUserId ? await User.findOne({ where: { id: vehicle.ownerUserId, workshopId: tester.workshopId, active: true }, transaction }) : null
  const car = carLabel(vehicle)
  const subject = `Signed off: ${car}, ${profile.name} v${version.versionNo}`
  const snagLine = unresolved ? `${unresolved} snag${unresolved === 1 ? '' : 's'} remain on the list, none of them blocking.` : 'No snags remain open.'
  const staffText = `${tester.name} road-tested and signed off ${profile.name} version ${version.versionNo} on ${car}. It is now the profile on the car.\n${snagLine}\n\n${absoluteUrl(`/cars/${vehicle.id}`)}`
  const ownerText = `Your car, ${vehicle.year} ${vehicle.make} ${vehicle.model}, has passed its road test with the "${profile.name}" controller settings, which are now the ones on the car.\n${snagLine}\n\nYour handover sheet: ${absoluteUrl(`/cars/${vehicle.id}/handover`)}\n\nThe settings were checked by a qualified engineer and proved on the road; drive within the rules that apply where you are.`
  await queueMail(transaction, [
    ...engineers.filter(e => e.id !== tester.id).map(e => ({ workshopId: tester.workshopId, to: e.email, subject, text: staffText })),
    ...(owner ? [{ workshopId: tester.workshopId, to: owner.email, subject: `Your ${vehicle.make} ${vehicle.model} has passed its road test`, text: ownerText }] : [])
  ])
}
