import type { Transaction } from 'sequelize'
import { Kit, Platform, Profile, ProfileVersion, Review, User, Vehicle } from '../../models'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import type { SignedIn } from '../guards/guards'
import type { EvaluationSnapshot, ReviewView, VersionSummary } from '../../../shared/schemas/profile-views'
import type { VersionState } from '../../../shared/schemas/version'
import { failedPeopleRules, personRefusal, stateAfter, stateRefusal, type VersionAction } from '../../../shared/schemas/version-lifecycle'

const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null)
const person = (u: User | null | undefined) => (u ? { id: u.id, name: u.name } : null)

export function reviewView(r: Review): ReviewView {
  return { id: r.id, decision: r.decision, comment: r.comment, reviewer: person(r.reviewer), createdAt: iso(r.createdAt)! }
}

export function dangerCountOf(evaluation: unknown): number | null {
  const warnings = (evaluation as EvaluationSnapshot | null)?.warnings
  return Array.isArray(warnings) ? warnings.filter(w => w.severity === 'danger').length : null
}

export function versionSummary(v: ProfileVersion & { reviews?: Review[] }): VersionSummary {
  const reviews = [...(v.reviews ?? [])].sort((a, b) => a.id - b.id)
  const last = reviews.at(-1)
  return {
    id: v.id, profileId: v.profileId, versionNo: v.versionNo, parentVersionId: v.parentVersionId, state: v.state, origin: v.origin,
    author: person(v.author), rationale: v.rationale, dangerCount: dangerCountOf(v.evaluation),
    roadTestId: v.roadTestId ?? null, submittedAt: iso(v.submittedAt), decidedAt: iso(v.decidedAt), createdAt: iso(v.createdAt)!, lastReview: last ? reviewView(last) : null
  }
}

export const authorInclude = { model: User, as: 'author', attributes: ['id', 'name'] }
export const reviewsInclude = { model: Review, as: 'reviews', include: [{ model: User, as: 'reviewer', attributes: ['id', 'name'] }] }

// What a version is evaluated on and named by: a car, or a kit's baseline (its spec template).
export interface VersionSubject { vehicleId: number | null, kitId: number | null, spec: VehicleSpec, name: string, shortName: string }
export interface VersionContext { version: ProfileVersion, profile: Profile, vehicle: Vehicle | null, kit: Kit | null, platform: Platform, subject: VersionSubject }
const withPlatform = [{ model: Platform, as: 'platform' }]

// A version of the signed-in person's workshop with its profile, car and drive unit; anything else is 404.
// With `lock`, the version row is locked FOR UPDATE first, so concurrent transitions queue behind it.
// The drive unit a profile's versions are for: its car's, or its kit's for a kit's baseline.
export async function platformOfProfile(profile: Profile, transaction?: Transaction): Promise<Platform | null> {
  const owner = profile.vehicleId
    ? await Vehicle.findByPk(profile.vehicleId, { transaction, include: withPlatform })
    : await Kit.findByPk(profile.kitId!, { transaction, include: withPlatform })
  return owner?.platform ?? null
}

export async function loadVersion(user: SignedIn, id: number, transaction?: Transaction): Promise<VersionContext> {
  const version = await ProfileVersion.findOne({
    where: { id, workshopId: user.workshopId }, transaction, ...(transaction ? { lock: transaction.LOCK.UPDATE } : {})
  })
  if (!version) throw createError({ statusCode: 404, message: 'No such version in this workshop.' })
  const profile = (await Profile.findByPk(version.profileId, { transaction }))!
  const vehicle = profile.vehicleId ? await Vehicle.findByPk(profile.vehicleId, { transaction, include: [...withPlatform, { model: User, as: 'owner', attributes: ['id', 'name'] }] }) : null
  const kit = vehicle ? null : await Kit.findByPk(profile.kitId!, { transaction, include: withPlatform })
  const subject = vehicle
    ? { vehicleId: vehicle.id, kitId: null, spec: vehicle.spec, name: `${vehicle.stockRef} (${vehicle.year} ${vehicle.make} ${vehicle.model})`, shortName: `${vehicle.stockRef} ${vehicle.make} ${vehicle.model}` }
    : { vehicleId: null, kitId: kit!.id, spec: kit!.specTemplate, name: `the ${kit!.name} kit's baseline`, shortName: `Kit ${kit!.name} baseline` }
  return { version, profile, vehicle, kit, platform: (vehicle ?? kit)!.platform!, subject }
}

// Checks a change against the version lifecycle's table (docs/version-lifecycle.md): 403 naming the person
// rule the actor fails, else 409 naming the state the version is in. Answers the state it moves to.
export function requireTransition(v: ProfileVersion, action: VersionAction, user: SignedIn, driverId?: number): VersionState {
  const failed = failedPeopleRules(action, { roles: user.roles, isAuthor: v.authorId === user.id, isDriver: driverId === user.id })
  if (failed.length) throw createError({ statusCode: 403, message: personRefusal(action, failed[0]!) })
  const state = v.state as VersionState
  const refusal = stateRefusal(action, state, v.versionNo)
  if (refusal) throw createError({ statusCode: 409, message: refusal, data: { state } })
  return stateAfter(action, state)
}

