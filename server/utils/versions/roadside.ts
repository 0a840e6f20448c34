// A roadside change (docs/version-lifecycle.md): settings changed while driving an open road test become the
// next version from the tested one (origin roadside), made by the one insert and sent for review by the one
// submit, in one transaction, so a refused submit leaves nothing behind.
import { Platform, Profile, ProfileVersion, RoadTest, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { RoadsideVersionInput } from '../../../shared/schemas/road-test'
import { canonicalJson } from '../../../shared/utils/canonical-json'
import { useDatabase } from '../database/db'
import { loadWorkshopSettings } from '../platforms/evaluation'
import { findRoadTest } from '../road-tests/record'
import { insertVersion } from './insert'
import { readVersion } from './read'
import { requireKnownSettings } from '../platforms/settings-check'
import { submitLoaded } from './submit'
import { loadVersion, requireTransition } from './views'

// Open: not signed off, and the version it tested still approved; only its driver may change it.
function requireOpen(user: SignedIn, rt: RoadTest, tested: ProfileVersion) {
  requireTransition(tested, 'roadside-change', user, rt.testerId)
  if (rt.signed) {
    throw createError({ statusCode: 409, message: `Road test ${rt.id} was signed off on ${rt.signed.at.slice(0, 10)}: it is closed. Start a new version from the one on the car instead.`, data: { signed: true } })
  }
}

export async function recordRoadsideVersion(user: SignedIn, roadTestId: number, input: RoadsideVersionInput) {
  const found = await findRoadTest(user, roadTestId)
  const { profileId } = (await ProfileVersion.findByPk(found.versionId, { attributes: ['profileId'] }))!
  const car = await Vehicle.findByPk(found.vehicleId, { include: [{ model: Platform, as: 'platform' }] })
  requireKnownSettings(car?.platform, input.parameters)
  const settings = await loadWorkshopSettings(user.workshopId)
  const versionId = await useDatabase().transaction(async (transaction) => {
    // The order sign-off locks in (profile, road test, version), so the two queue rather than deadlock.
    const lock = transaction.LOCK.UPDATE
    const profile = (await Profile.findByPk(profileId, { lock, transaction }))!
    const rt = (await RoadTest.findByPk(roadTestId, { lock, transaction }))!
    const tested = (await ProfileVersion.findByPk(rt.versionId, { lock, transaction }))!
    requireOpen(user, rt, tested)
    if (canonicalJson(input.parameters) === canonicalJson(tested.parameters)) {
      throw createError({ statusCode: 400, message: `These are the settings of version ${tested.versionNo}: record only what changed at the roadside.`, data: { fields: [{ path: 'parameters', message: 'Nothing changed' }] } })
    }
    const draft = await insertVersion(transaction, user, {
      profile, vehicleId: rt.vehicleId, parent: tested, parameters: input.parameters, rationale: input.rationale, origin: 'roadside', roadTestId: rt.id
    })
    await submitLoaded(transaction, user, await loadVersion(user, draft.id, transaction), input.justifications, settings)
    return draft.id
  })
  return readVersion(user, versionId)
}
