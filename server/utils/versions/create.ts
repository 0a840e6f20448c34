import type { Transaction } from 'sequelize'
import { Profile, ProfileVersion, type Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import { defaultParameters } from '../../../shared/platforms'
import { jsonPatch } from '../../../shared/utils/json-patch'
import type { ProfileCreate, VersionCreate, VersionUpdate } from '../../../shared/schemas/profile'
import type { VersionOrigin } from '../../../shared/schemas/version'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { versionContentHash } from './content'
import { readVersion } from './read'
import { loadVersion, assertVersionState } from './views'

// Two people naming a profile the same at the same moment: the unique index decides, the loser hears why.
function sameNameRace(e: unknown): never {
  if ((e as { name?: string }).name === 'SequelizeUniqueConstraintError') {
    throw createError({ statusCode: 409, message: 'This car already has a profile with that name.', data: { fields: [{ path: 'name', message: 'Already used on this car' }] } })
  }
  throw e
}

// baselineVersionId: the kit baseline version the settings were built from (inherited from the parent unless given).
export interface NewVersion { parameters: Record<string, number>, rationale: string, parent: ProfileVersion | null, origin: VersionOrigin, baselineVersionId?: number | null }

// The next number is max + 1, read after the profile row is locked, so concurrent creations queue and
// never share or skip a number (the database trigger checks the same).
export async function insertVersion(t: Transaction, user: SignedIn, profile: Profile, vehicleId: number | null, input: NewVersion) {
  await Profile.findByPk(profile.id, { transaction: t, lock: t.LOCK.UPDATE })
  const max = await ProfileVersion.max<number | null, ProfileVersion>('versionNo', { where: { profileId: profile.id }, transaction: t })
  const content = {
    profileId: profile.id, versionNo: (max ?? 0) + 1, parentVersionId: input.parent?.id ?? null,
    parameters: input.parameters, rationale: input.rationale, authorId: user.id, origin: input.origin
  }
  const contentHash = versionContentHash(content)
  const baselineVersionId = input.baselineVersionId === undefined ? input.parent?.baselineVersionId ?? null : input.baselineVersionId
  const version = await ProfileVersion.create({ ...content, workshopId: user.workshopId, contentHash, baselineVersionId }, { transaction: t })
  await appendAuditEvent(t, {
    workshopId: user.workshopId, vehicleId, actorId: user.id, action: 'version.created', entityType: 'version', entityId: version.id,
    data: {
      profileId: profile.id, profileName: profile.name, versionNo: version.versionNo, parentVersionId: content.parentVersionId,
      parentVersionNo: input.parent?.versionNo ?? null, origin: input.origin, contentHash, parameters: input.parameters, rationale: input.rationale, ...(baselineVersionId ? { baselineVersionId } : {}),
      patchFromParent: input.parent ? jsonPatch(input.parent.parameters, input.parameters) : null
    }
  })
  return version
}

// A new profile of a car or of a kit (its baseline), with its event in the history.
export async function insertProfile(t: Transaction, user: SignedIn, owner: { vehicleId: number } | { kitId: number }, name: string) {
  const profile = await Profile.create({ workshopId: user.workshopId, ...owner, name }, { transaction: t })
  const vehicleId = 'vehicleId' in owner ? owner.vehicleId : null
  await appendAuditEvent(t, { workshopId: user.workshopId, vehicleId, actorId: user.id, action: 'profile.created', entityType: 'profile', entityId: profile.id, data: { name, ...('kitId' in owner ? { kitId: owner.kitId } : {}) } })
  return profile
}

export async function createProfile(user: SignedIn, vehicle: Vehicle, input: ProfileCreate) {
  const parameters = input.parameters ?? defaultParameters(vehicle.platform!)
  const versionId = await useDatabase().transaction(async (t) => {
    const clash = await Profile.findOne({ where: { vehicleId: vehicle.id, name: input.name }, transaction: t })
    if (clash) throw createError({ statusCode: 409, message: `This car already has a profile called "${input.name}".`, data: { fields: [{ path: 'name', message: 'Already used on this car' }] } })
    const profile = await insertProfile(t, user, { vehicleId: vehicle.id }, input.name)
    const version = await insertVersion(t, user, profile, vehicle.id, { parameters, rationale: input.rationale, parent: null, origin: 'workshop' })
    return version.id
  }).catch(sameNameRace)
  return readVersion(user, versionId)
}

// A new draft from any earlier version of the profile (by default the one on the car, else the latest).
// `baselineVersionId` is given only when rebasing onto a newer kit baseline.
export async function createVersion(user: SignedIn, profileId: number, input: VersionCreate, origin: VersionOrigin = 'workshop', baselineVersionId?: number) {
  const profile = await Profile.findOne({ where: { id: profileId, workshopId: user.workshopId } })
  if (!profile) throw createError({ statusCode: 404, message: 'No such profile in this workshop.' })
  const versionId = await useDatabase().transaction(async (t) => {
    const parent = input.fromVersionId
      ? await ProfileVersion.findOne({ where: { id: input.fromVersionId, profileId: profile.id }, transaction: t })
      : await ProfileVersion.findOne({ where: { profileId: profile.id, ...(profile.onCarVersionId ? { id: profile.onCarVersionId } : {}) }, order: [['versionNo', 'DESC']], transaction: t })
    if (input.fromVersionId && !parent) {
      throw createError({ statusCode: 400, message: 'The version to start from is not a version of this profile.', data: { fields: [{ path: 'fromVersionId', message: 'Not a version of this profile' }] } })
    }
    const parameters = input.parameters ?? parent?.parameters ?? {}
    const version = await insertVersion(t, user, profile, profile.vehicleId, { parameters, rationale: input.rationale, parent, origin, baselineVersionId })
    return version.id
  })
  return readVersion(user, versionId)
}

// Saves a draft. A save made from a stale copy changes nothing and answers both sides, so the person can choose.
export async function updateDraft(user: SignedIn, id: number, input: VersionUpdate) {
  await useDatabase().transaction(async (t) => {
    const { version: v, subject } = await loadVersion(user, id, t)
    if (v.authorId !== user.id) throw createError({ statusCode: 403, message: 'Only the author of a draft can change it; start a new version from it instead.' })
    assertVersionState(v, ['draft'], 'changed')
    if (v.lockVersion !== input.lockVersion) {
      throw createError({
        statusCode: 409,
        message: 'This draft was saved elsewhere since you loaded it. Nothing was overwritten: choose which values to keep and save again.',
        data: {
          state: v.state,
          stored: { parameters: v.parameters, rationale: v.rationale, lockVersion: v.lockVersion, updatedAt: v.updatedAt },
          attempted: { parameters: input.parameters ?? null, rationale: input.rationale ?? null, lockVersion: input.lockVersion }
        }
      })
    }
    const before = { parameters: v.parameters, rationale: v.rationale }
    const after = { parameters: input.parameters ?? v.parameters, rationale: input.rationale ?? v.rationale }
    const patch = jsonPatch(before, after)
    if (!patch.length) return
    const contentHash = versionContentHash({ ...v.get(), ...after })
    await v.update({ ...after, lockVersion: v.lockVersion + 1, contentHash }, { transaction: t })
    await appendAuditEvent(t, {
      workshopId: user.workshopId, vehicleId: subject.vehicleId, actorId: user.id, action: 'version.edited', entityType: 'version', entityId: v.id,
      data: { versionNo: v.versionNo, patch, lockVersion: v.lockVersion, contentHash }
    })
  })
  return readVersion(user, id)
}
