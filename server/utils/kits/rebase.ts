// Starting a car's new version on the kit's newer baseline, three ways (docs/kits.md).
import { Kit, Profile, ProfileVersion, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { RebaseInput, RebasePreview } from '../../../shared/schemas/kit'
import { schemaProperties } from '../../../shared/compute/parameter-input'
import { mergeThreeWay, settleMerge } from '../../../shared/utils/three-way'
import { createVersion } from '../versions/create'
import { currentVersion, latestApprovedBaseline } from './baseline'

async function rebaseContext(user: SignedIn, profileId: number) {
  const profile = await Profile.findOne({ where: { id: profileId, workshopId: user.workshopId } })
  const vehicle = profile?.vehicleId ? await Vehicle.findByPk(profile.vehicleId, { include: ['platform'] }) : null
  if (!profile || !vehicle) throw createError({ statusCode: 404, message: 'No such car profile in this workshop.' })
  const current = currentVersion(await ProfileVersion.findAll({ where: { profileId: profile.id } }))
  const from = current?.baselineVersionId ? await ProfileVersion.findByPk(current.baselineVersionId) : null
  const baseProfile = from ? await Profile.findByPk(from.profileId, { include: [{ model: Kit, as: 'kit' }] }) as Profile & { kit: Kit | null } : null
  if (!current || !from || !baseProfile?.kit) throw createError({ statusCode: 409, message: 'This profile was not built from a kit, so it has no baseline to move onto.' })
  const to = (await latestApprovedBaseline(baseProfile.id)) ?? from
  return { profile, vehicle, current, from, to, kit: baseProfile.kit }
}

// What a rebase would give: each setting with the old baseline, the car, the new baseline and the result.
export async function previewRebase(user: SignedIn, profileId: number): Promise<RebasePreview> {
  const { profile, vehicle, current, from, to, kit } = await rebaseContext(user, profileId)
  const props = schemaProperties(vehicle.platform!.schema)
  const rows = mergeThreeWay(from.parameters, current.parameters, to.parameters).map(r => ({
    ...r, label: typeof props[r.name]?.title === 'string' ? props[r.name]!.title as string : r.name, unit: typeof props[r.name]?.unit === 'string' ? props[r.name]!.unit as string : ''
  }))
  return {
    profileId: profile.id, kit: { id: kit.id, name: kit.name }, carVersion: { id: current.id, versionNo: current.versionNo },
    from: { id: from.id, versionNo: from.versionNo }, to: { id: to.id, versionNo: to.versionNo }, moved: to.versionNo > from.versionNo,
    rows, conflicts: rows.filter(r => r.conflict).map(r => r.name)
  }
}

// A new draft of the car's profile on the newer baseline; every conflict must have been chosen.
export async function rebaseProfile(user: SignedIn, profileId: number, input: RebaseInput) {
  const { current, from, to, kit } = await rebaseContext(user, profileId)
  if (to.versionNo <= from.versionNo) throw createError({ statusCode: 409, message: `This profile already stands on the ${kit.name} kit's newest approved baseline (version ${from.versionNo}).` })
  const { parameters, unresolved } = settleMerge(mergeThreeWay(from.parameters, current.parameters, to.parameters), input.choices as Record<string, 'car' | 'kit'>)
  if (unresolved.length) {
    throw createError({
      statusCode: 409, message: `Both the car and the kit's baseline changed ${unresolved.length === 1 ? 'a setting' : `${unresolved.length} settings`}; choose which value to keep for each.`,
      data: { conflicts: unresolved, fields: unresolved.map(n => ({ path: `choices.${n}`, message: 'Choose the car\'s value or the kit\'s' })) }
    })
  }
  const rationale = input.rationale || `Moved onto the ${kit.name} kit's baseline version ${to.versionNo} (from version ${from.versionNo}), keeping this car's own settings.`
  return createVersion(user, profileId, { fromVersionId: current.id, parameters, rationale }, to.id)
}
