// Settings changed at the roadside become a new version (origin roadside, parent the tested version, in
// review) so they go through four-eyes review like any other. Numbered max+1 with the profile row locked.
import { QueryTypes } from 'sequelize'
import { Profile, ProfileVersion, Vehicle, Platform } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { RoadsideVersionInput } from '../../../shared/schemas/road-test'
import { canonicalJson } from '../../../shared/utils/canonical-json'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { queueMail, peopleWithRole, absoluteUrl } from '../mail/outbox'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { carLabel, findRoadTest } from '../road-tests/record'
import { versionContentHash, snapshotOf } from './content'

export async function recordRoadsideVersion(user: SignedIn, roadTestId: number, input: RoadsideVersionInput) {
  const rt = await findRoadTest(user, roadTestId)
  const tested = await ProfileVersion.findByPk(rt.versionId)
  const vehicle = await Vehicle.findByPk(rt.vehicleId, { include: [{ model: Platform, as: 'platform' }] })
  if (canonicalJson(input.parameters) === canonicalJson(tested!.parameters)) {
    throw createError({ statusCode: 400, message: `These are the settings of version ${tested!.versionNo}: record only what changed at the roadside.`, data: { fields: [{ path: 'parameters', message: 'Nothing changed' }] } })
  }
  const evaluation = evaluateOnServer(vehicle!.spec, vehicle!.platform!, input.parameters, await loadWorkshopSettings(user.workshopId))
  if (!evaluation.valid) {
    throw createError({ statusCode: 400, message: `Please check: ${evaluation.errors.map(e => `${e.path} (${e.message})`).join('; ')}`.slice(0, 500), data: { fields: evaluation.errors } })
  }
  const sequelize = useDatabase()
  const created = await sequelize.transaction(async (transaction) => {
    const profile = await Profile.findByPk(tested!.profileId, { lock: transaction.LOCK.UPDATE, transaction })
    const [{ next }] = await sequelize.query<{ next: number }>('SELECT coalesce(max("versionNo"), 0) + 1 AS next FROM profile_versions WHERE "profileId" = :p', { replacements: { p: profile!.id }, type: QueryTypes.SELECT, transaction }) as [{ next: number }]
    const now = new Date()
    const content = { profileId: profile!.id, versionNo: Number(next), parentVersionId: tested!.id, parameters: input.parameters, rationale: input.rationale, authorId: user.id }
    const version = await ProfileVersion.create({
      ...content, workshopId: user.workshopId, state: 'in-review', origin: 'roadside', roadTestId: rt.id, baselineVersionId: tested!.baselineVersionId,
      evaluation: snapshotOf(evaluation, now) as unknown as Record<string, unknown>, contentHash: versionContentHash({ ...content, origin: 'roadside' }), submittedAt: now
    }, { transaction })
    await appendAuditEvent(transaction, {
      workshopId: user.workshopId, vehicleId: rt.vehicleId, actorId: user.id, action: 'version.roadside-recorded', entityType: 'version', entityId: version.id,
      data: { roadTestId: rt.id, profileId: profile!.id, versionNo: version.versionNo, parentVersionId: tested!.id, contentHash: version.contentHash, warnings: evaluation.warnings.map(w => ({ rule: w.rule, severity: w.severity })) }
    })
    const engineers = (await peopleWithRole(user.workshopId, 'engineer', transaction)).filter(e => e.id !== user.id)
    const car = carLabel(vehicle!)
    await queueMail(transaction, engineers.map(e => ({
      workshopId: user.workshopId, to: e.email, subject: `Review wanted: roadside change on ${car}, ${profile!.name} v${version.versionNo}`,
      text: `${user.name} changed settings at the roadside during road test ${rt.id} of version ${tested!.versionNo} and recorded them as version ${version.versionNo}, which awaits your review.\n\nWhy: ${input.rationale}\n\n${absoluteUrl(`/versions/${version.id}`)}`
    })))
    return version
  })
  return { id: created.id, profileId: created.profileId, versionNo: created.versionNo, parentVersionId: created.parentVersionId, state: created.state, origin: created.origin, roadTestId: created.roadTestId, contentHash: created.contentHash, warnings: evaluation.warnings }
}
