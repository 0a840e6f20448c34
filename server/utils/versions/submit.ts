// The one submit, whatever made the draft (docs/version-lifecycle.md): the server evaluates it again,
// refuses hard errors, wants a written justification for every danger warning, keeps the evaluation the
// reviewer will be shown, records `version.submitted` and asks the engineers for a review.
import type { Transaction } from 'sequelize'
import type { SignedIn } from '../guards/guards'
import type { SubmitInput } from '../../../shared/schemas/profile'
import type { WorkshopSettings } from '../../../shared/compute/settings'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { snapshotOf } from './content'
import { readVersion } from './read'
import { mailReviewWanted } from './review-mail'
import { loadVersion, requireTransition, type VersionContext } from './views'

// Inside the caller's transaction, with the version row locked (loadVersion with a transaction does).
export async function submitLoaded(t: Transaction, user: SignedIn, about: VersionContext, justifications: SubmitInput['justifications'], settings: WorkshopSettings) {
  const v = about.version
  const to = requireTransition(v, 'submit', user)
  const evaluation = evaluateOnServer(about.subject.spec, about.platform, v.parameters, settings)
  if (!evaluation.valid) {
    throw createError({ statusCode: 400, message: `This version has hard errors; correct them before sending it for review: ${evaluation.errors.map(e => e.message).join('; ')}`.slice(0, 500), data: { fields: evaluation.errors } })
  }
  const dangers = evaluation.warnings.filter(w => w.severity === 'danger')
  const given = justifications as Record<string, string>
  const missing = dangers.filter(w => !given[w.rule])
  if (missing.length) {
    const rules = [...new Set(missing.map(w => w.rule))]
    throw createError({
      statusCode: 400,
      message: `Each danger warning needs a written justification before review (${rules.join(', ')}).`,
      data: { fields: rules.map(rule => ({ path: `justifications.${rule}`, message: 'Say why this is acceptable on this car' })), warnings: missing }
    })
  }
  const warned = new Set(evaluation.warnings.map(w => w.rule as string))
  const kept = Object.fromEntries(Object.entries(given).filter(([rule, text]) => warned.has(rule) && text))
  await v.update({ state: to, evaluation: snapshotOf(evaluation) as unknown as Record<string, unknown>, justifications: kept, submittedAt: new Date(), lockVersion: v.lockVersion + 1 }, { transaction: t })
  await appendAuditEvent(t, {
    workshopId: user.workshopId, vehicleId: about.subject.vehicleId, actorId: user.id, action: 'version.submitted', entityType: 'version', entityId: v.id,
    data: { versionNo: v.versionNo, contentHash: v.contentHash, origin: v.origin, dangerCount: dangers.length, warnings: evaluation.warnings.map(w => ({ rule: w.rule, severity: w.severity })), justifications: kept }
  })
  await mailReviewWanted(t, user, about, dangers.length)
}

export async function submitVersion(user: SignedIn, id: number, input: SubmitInput) {
  const settings = await loadWorkshopSettings(user.workshopId)
  await useDatabase().transaction(async t => submitLoaded(t, user, await loadVersion(user, id, t), input.justifications, settings))
  return readVersion(user, id)
}
