import type { Transaction } from 'sequelize'
import { Platform, Profile, ProfileVersion, Review, User, Vehicle } from '../../models'
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

export interface VersionContext { version: ProfileVersion, profile: Profile, vehicle: Vehicle, platform: Platform }

// A version of the signed-in person's workshop with its profile, car and drive unit; anything else is 404.
// With `lock`, the version row is locked FOR UPDATE first, so concurrent transitions queue behind it.
export async function loadVersion(user: SignedIn, id: number, transaction?: Transaction): Promise<VersionContext> {
  const version = await ProfileVersion.findOne({
    where: { id, workshopId: user.workshopId }, transaction, ...(transaction ? { lock: transaction.LOCK.UPDATE } : {})
  })
  if (!version) throw createError({ statusCode: 404, message: 'No such version in this workshop.' })
  const profile = await Profile.findByPk(version.profileId, { transaction, include: [{ model: Vehicle, as: 'vehicle', include: [{ model: Platform, as: 'platform' }, { model: User, as: 'owner', attributes: ['id', 'name'] }] }] })
  const vehicle = (profile as Profile & { vehicle: Vehicle }).vehicle
  return { version, profile: profile!, vehicle, platform: vehicle.platform! }
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

