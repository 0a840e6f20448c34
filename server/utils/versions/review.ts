import { Review, User } from '../../models'
import type { SignedIn } from '../guards/guards'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { readVersion } from './read'
import { mailDecision } from './review-mail'
import { loadVersion, requireTransition } from './views'

// The author takes a draft or a version awaiting review off the table; it stays in the record.
export async function withdrawVersion(user: SignedIn, id: number) {
  await useDatabase().transaction(async (t) => {
    const { version: v, subject } = await loadVersion(user, id, t)
    const fromState = v.state
    const to = requireTransition(v, 'withdraw', user)
    await v.update({ state: to, decidedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
    await appendAuditEvent(t, { workshopId: user.workshopId, vehicleId: subject.vehicleId, actorId: user.id, action: 'version.withdrawn', entityType: 'version', entityId: v.id, data: { versionNo: v.versionNo, fromState } })
  })
  return readVersion(user, id)
}

// Four eyes: an engineer who is not the author approves or sends back a version awaiting review.
export async function decideVersion(user: SignedIn, id: number, decision: 'approve' | 'reject', comment: string) {
  await useDatabase().transaction(async (t) => {
    const about = await loadVersion(user, id, t)
    const v = about.version
    const to = requireTransition(v, decision, user)
    const review = await Review.create({ workshopId: user.workshopId, versionId: v.id, reviewerId: user.id, decision, comment }, { transaction: t })
    await v.update({ state: to, decidedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
    await appendAuditEvent(t, {
      workshopId: user.workshopId, vehicleId: about.subject.vehicleId, actorId: user.id, action: decision === 'approve' ? 'version.approved' : 'version.rejected',
      entityType: 'version', entityId: v.id, data: { versionNo: v.versionNo, reviewId: review.id, comment, contentHash: v.contentHash }
    })
    await mailDecision(t, user, await User.findByPk(v.authorId, { transaction: t }), about, decision, comment)
  })
  return readVersion(user, id)
}
