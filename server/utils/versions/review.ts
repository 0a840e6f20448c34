import { Review, User } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { SubmitInput } from '../../../shared/schemas/profile'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { snapshotOf } from './content'
import { readVersion } from './read'
import { mailReviewWanted, mailDecision } from './review-mail'
import { loadVersion, assertVersionState } from './views'

function requireAuthor(user: SignedIn, authorId: number, doing: string) {
  if (authorId !== user.id) throw createError({ statusCode: 403, message: `Only the version's author can ${doing} it.` })
}

// Sends a draft for review: the server evaluates it again, refuses hard errors, wants a written
// justification for every danger warning, and keeps the evaluation the reviewer will be shown.
export async function submitVersion(user: SignedIn, id: number, input: SubmitInput) {
  const settings = await loadWorkshopSettings(user.workshopId)
  await useDatabase().transaction(async (t) => {
    const about = await loadVersion(user, id, t)
    const v = about.version
    requireAuthor(user, v.authorId, 'send')
    assertVersionState(v, ['draft'], 'sent for review')
    const evaluation = evaluateOnServer(about.subject.spec, about.platform, v.parameters, settings)
    if (!evaluation.valid) {
      throw createError({ statusCode: 400, message: 'This version has hard errors; correct them before sending it for review.', data: { fields: evaluation.errors } })
    }
    const dangers = evaluation.warnings.filter(w => w.severity === 'danger')
    const justifications = input.justifications as Record<string, string>
    const missing = dangers.filter(w => !justifications[w.rule])
    if (missing.length) {
      throw createError({
        statusCode: 400,
        message: `Each danger warning needs a written justification before review (${missing.map(w => w.rule).join(', ')}).`,
        data: { fields: missing.map(w => ({ path: `justifications.${w.rule}`, message: 'Say why this is acceptable on this car' })), warnings: missing }
      })
    }
    const warned = new Set(evaluation.warnings.map(w => w.rule as string))
    const kept = Object.fromEntries(Object.entries(justifications).filter(([rule, text]) => warned.has(rule) && text))
    await v.update({ state: 'in-review', evaluation: snapshotOf(evaluation) as unknown as Record<string, unknown>, justifications: kept, submittedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
    await appendAuditEvent(t, {
      workshopId: user.workshopId, vehicleId: about.subject.vehicleId, actorId: user.id, action: 'version.submitted', entityType: 'version', entityId: v.id,
      data: { versionNo: v.versionNo, contentHash: v.contentHash, dangerCount: dangers.length, warnings: evaluation.warnings.map(w => ({ rule: w.rule, severity: w.severity })), justifications: kept }
    })
    await mailReviewWanted(t, user, about, dangers.length)
  })
  return readVersion(user, id)
}

// The author takes a draft or a version awaiting review off the table; it stays in the record.
export async function withdrawVersion(user: SignedIn, id: number) {
  await useDatabase().transaction(async (t) => {
    const { version: v, subject } = await loadVersion(user, id, t)
    requireAuthor(user, v.authorId, 'withdraw')
    assertVersionState(v, ['draft', 'in-review'], 'withdrawn')
    const fromState = v.state
    await v.update({ state: 'withdrawn', decidedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
    await appendAuditEvent(t, { workshopId: user.workshopId, vehicleId: subject.vehicleId, actorId: user.id, action: 'version.withdrawn', entityType: 'version', entityId: v.id, data: { versionNo: v.versionNo, fromState } })
  })
  return readVersion(user, id)
}

// Four eyes: an engineer who is not the author approves or sends back a version awaiting review.
export async function decideVersion(user: SignedIn, id: number, decision: 'approve' | 'reject', comment: string) {
  await useDatabase().transaction(async (t) => {
    const about = await loadVersion(user, id, t)
    const v = about.version
    if (v.authorId === user.id) {
      throw createError({ statusCode: 403, message: 'Four eyes: the author of a version cannot review it. Another engineer must.' })
    }
    assertVersionState(v, ['in-review'], decision === 'approve' ? 'approved' : 'sent back')
    const review = await Review.create({ workshopId: user.workshopId, versionId: v.id, reviewerId: user.id, decision, comment }, { transaction: t })
    await v.update({ state: decision === 'approve' ? 'approved' : 'rejected', decidedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
    await appendAuditEvent(t, {
      workshopId: user.workshopId, vehicleId: about.subject.vehicleId, actorId: user.id, action: decision === 'approve' ? 'version.approved' : 'version.rejected',
      entityType: 'version', entityId: v.id, data: { versionNo: v.versionNo, reviewId: review.id, comment, contentHash: v.contentHash }
    })
    await mailDecision(t, user, await User.findByPk(v.authorId, { transaction: t }), about, decision, comment)
  })
  return readVersion(user, id)
}
