import type { SettingValues } from '../../../shared/compute/parameter-input'
// The one way a version comes to exist, whatever made it (a new profile, a new draft from any version,
// a roadside change): numbered, hashed and recorded alike (docs/version-lifecycle.md).
import type { Transaction } from 'sequelize'
import { Profile, ProfileVersion } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { VersionOrigin } from '../../../shared/schemas/version'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { appendAuditEvent } from '../history/audit'
import { versionContentHash } from './content'

export interface NewVersion {
  profile: Profile
  // The car the history is kept under; null where a profile belongs to no car.
  vehicleId: number | null
  parent: ProfileVersion | null
  parameters: SettingValues
  rationale: string
  origin: VersionOrigin
  roadTestId?: number | null
  // The kit baseline version the settings were built from; inherited from the parent unless given (docs/kits.md).
  baselineVersionId?: number | null
}

// The next number is max + 1, read after the profile row is locked, so concurrent creations queue and
// never share or skip a number (the database trigger checks the same). Always a draft: the one submit
// (./submit.ts) is the only way out of draft, in the same transaction when the caller wants it at once.
export async function insertVersion(t: Transaction, user: SignedIn, input: NewVersion): Promise<ProfileVersion> {
  const { profile, parent } = input
  await Profile.findByPk(profile.id, { transaction: t, lock: t.LOCK.UPDATE })
  const max = await ProfileVersion.max<number | null, ProfileVersion>('versionNo', { where: { profileId: profile.id }, transaction: t })
  const content = {
    profileId: profile.id, versionNo: (max ?? 0) + 1, parentVersionId: parent?.id ?? null,
    parameters: input.parameters, rationale: input.rationale, authorId: user.id, origin: input.origin
  }
  const contentHash = versionContentHash(content)
  const roadTestId = input.roadTestId ?? null
  const baselineVersionId = input.baselineVersionId === undefined ? parent?.baselineVersionId ?? null : input.baselineVersionId
  const version = await ProfileVersion.create({ ...content, workshopId: user.workshopId, state: 'draft', roadTestId, contentHash, baselineVersionId }, { transaction: t })
  await appendAuditEvent(t, {
    workshopId: user.workshopId, vehicleId: input.vehicleId, actorId: user.id, action: 'version.created', entityType: 'version', entityId: version.id,
    data: {
      profileId: profile.id, profileName: profile.name, versionNo: version.versionNo, parentVersionId: content.parentVersionId,
      parentVersionNo: parent?.versionNo ?? null, origin: input.origin, roadTestId, contentHash, parameters: input.parameters, rationale: input.rationale, ...(baselineVersionId ? { baselineVersionId } : {}),
      patchFromParent: parent ? jsonPatch(parent.parameters, input.parameters) : null
    }
  })
  return version
}
