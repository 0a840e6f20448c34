import type { Transaction } from 'sequelize'
import type { Vehicle } from '../../models';
import { Profile, ProfileVersion } from '../../models'
import { requireKnownSettings } from '../platforms/settings-check'
import type { SignedIn } from '../guards/guards'
import { defaultParameters } from '../../../shared/platforms'
import { jsonPatch } from '../../../shared/utils/json-patch'
import type { ProfileCreate, VersionCreate, VersionUpdate } from '../../../shared/schemas/profile'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { versionContentHash } from './content'
import { insertVersion } from './insert'
import { readVersion } from './read'
import { loadVersion, platformOfProfile, requireTransition } from './views'

// Two people naming a profile the same at the same moment: the unique index decides, the loser hears why.
function sameNameRace(e: unknown): never {
  if ((e as { name?: string }).name === 'SequelizeUniqueConstraintError') {
    throw createError({ statusCode: 409, message: 'This car already has a profile with that name.', data: { fields: [{ path: 'name', message: 'Already used on this car' }] } })
  }
  throw e
}

// A new profile of a car or of a kit (its baseline), with its event in the history.
export async function insertProfile(t: Transaction, user: SignedIn, owner: { vehicleId: number } | { kitId: number }, name: string) {
  const profile = await Profile.create({ workshopId: user.workshopId, ...owner, name }, { transaction: t })
  const vehicleId = 'vehicleId' in owner ? owner.vehicleId : null
  await appendAuditEvent(t, { workshopId: user.workshopId, vehicleId, actorId: user.id, action: 'profile.created', entityType: 'profile', entityId: profile.id, data: { name, ...('kitId' in owner ? { kitId: owner.kitId } : {}) } })
  return profile
}

export async function createProfile(user: SignedIn, vehicle: Vehicle, input: ProfileCreate) {
  requireKnownSettings(vehicle.platform, input.parameters)
  const parameters = input.parameters ?? defaultParameters(vehicle.platform!)
  const versionId = await useDatabase().transaction(async (t) => {
    const clash = await Profile.findOne({ where: { vehicleId: vehicle.id, name: input.name }, transaction: t })
    if (clash) throw createError({ statusCode: 409, message: `This car already has a profile called "${input.name}".`, data: { fields: [{ path: 'name', message: 'Already used on this car' }] } })
    const profile = await insertProfile(t, user, { vehicleId: vehicle.id }, input.name)
    const version = await insertVersion(t, user, { profile, vehicleId: vehicle.id, parameters, rationale: input.rationale, parent: null, origin: 'workshop' })
    return version.id
  }).catch(sameNameRace)
  return readVersion(user, versionId)
}

// A new draft from any earlier version of the profile (by default the one on the car, else the latest).
// `baselineVersionId` is given only when moving onto a newer kit baseline (docs/kits.md).
export async function createVersion(user: SignedIn, profileId: number, input: VersionCreate, baselineVersionId?: number) {
  const profile = await Profile.findOne({ where: { id: profileId, workshopId: user.workshopId } })
  if (!profile) throw createError({ statusCode: 404, message: 'No such profile in this workshop.' })
  // A kit's baseline is checked against the kit's drive unit, as a car's profile against the car's.
  if (input.parameters) requireKnownSettings(await platformOfProfile(profile), input.parameters)
  const versionId = await useDatabase().transaction(async (t) => {
    const parent = input.fromVersionId
      ? await ProfileVersion.findOne({ where: { id: input.fromVersionId, profileId: profile.id }, transaction: t })
      : await ProfileVersion.findOne({ where: { profileId: profile.id, ...(profile.onCarVersionId ? { id: profile.onCarVersionId } : {}) }, order: [['versionNo', 'DESC']], transaction: t })
    if (input.fromVersionId && !parent) {
      throw createError({ statusCode: 400, message: 'The version to start from is not a version of this profile.', data: { fields: [{ path: 'fromVersionId', message: 'Not a version of this profile' }] } })
    }
    const parameters = input.parameters ?? parent?.parameters ?? {}
    const version = await insertVersion(t, user, { profile, vehicleId: profile.vehicleId, parameters, rationale: input.rationale, parent, origin: 'workshop', baselineVersionId })
    return version.id
  })
  return readVersion(user, versionId)
}

// Saves a draft. A save made from a stale copy changes nothing and answers both sides, so the person can choose.
export async function updateDraft(user: SignedIn, id: number, input: VersionUpdate) {
  await useDatabase().transaction(async (t) => {
    const { version: v, platform, subject } = await loadVersion(user, id, t)
    requireTransition(v, 'edit', user)
    requireKnownSettings(platform, input.parameters)
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
