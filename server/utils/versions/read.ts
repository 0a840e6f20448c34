import { QueryTypes } from 'sequelize'
import { Profile, ProfileVersion, Review, User, type Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { EvaluationSnapshot, HistoryEntry, ProfileView, VersionView } from '../../../shared/schemas/profile-views'
import { useDatabase } from '../database/db'
import { ACTOR_NAME_SQL, withRecordedPeople } from '../history/recorded-names'
import { vehicleView } from '../fleet/vehicles'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { profileBaselines } from '../kits/baseline'
import { reviewView, versionSummary, authorInclude, reviewsInclude, loadVersion } from './views'

interface EventRow { id: string, action: string, actorId: number | null, actorName: string | null, createdAt: Date, data: Record<string, unknown> }

// The version's own events from the audit chain: created, edited, submitted, decided, withdrawn.
async function versionHistory(workshopId: number, versionId: number): Promise<HistoryEntry[]> {
  const rows = await useDatabase().query<EventRow>(
    `SELECT e.id, e.action, e."actorId", ${ACTOR_NAME_SQL} AS "actorName", e."createdAt", e.data
       FROM audit_events e LEFT JOIN users u ON u.id = e."actorId"
      WHERE e."workshopId" = :workshopId AND e."entityType" = 'version' AND e."entityId" = :versionId ORDER BY e.id`,
    { replacements: { workshopId, versionId: String(versionId) }, type: QueryTypes.SELECT })
  return rows.map(r => ({
    id: String(r.id), action: r.action, actor: r.actorId ? { id: r.actorId, name: r.actorName ?? '' } : null,
    createdAt: new Date(r.createdAt).toISOString(), data: r.data
  }))
}

export async function readVersion(user: SignedIn, id: number): Promise<VersionView> {
  const { version: v, profile, vehicle, kit, platform, subject } = await loadVersion(user, id)
  const [author, reviews, parent, history, settings] = await Promise.all([
    User.findByPk(v.authorId, { attributes: ['id', 'name'] }),
    Review.findAll({ where: { versionId: v.id }, include: [{ model: User, as: 'reviewer', attributes: ['id', 'name'] }], order: [['id', 'ASC']] }),
    v.parentVersionId ? ProfileVersion.findByPk(v.parentVersionId, { attributes: ['id', 'versionNo'] }) : null,
    versionHistory(user.workshopId, v.id),
    loadWorkshopSettings(user.workshopId)
  ])
  v.author = author ?? undefined
  const { lastReview: _last, ...summary } = versionSummary(v)
  // People as the history named them when they acted, so renaming someone later does not rewrite this page.
  const asRecorded = (e: HistoryEntry | undefined, today: { id: number, name: string } | null) => (e?.actor?.name ? e.actor : today)
  const decisions = history.filter(h => h.action === 'version.approved' || h.action === 'version.rejected')
  return {
    ...summary,
    author: asRecorded(history.find(h => h.action === 'version.created'), summary.author),
    parameters: v.parameters,
    justifications: v.justifications,
    evaluation: v.evaluation as EvaluationSnapshot | null,
    contentHash: v.contentHash,
    lockVersion: v.lockVersion,
    onCar: profile.onCarVersionId === v.id,
    profile: { id: profile.id, name: profile.name, onCarVersionId: profile.onCarVersionId },
    vehicle: vehicle ? vehicleView(vehicle) : null,
    kit: kit ? { id: kit.id, name: kit.name, specTemplate: kit.specTemplate } : null,
    baselineVersionId: v.baselineVersionId ?? null,
    platform: { key: platform.key, name: platform.name, motorMaxRpm: platform.motorMaxRpm, torqueConstantNmPerA: platform.torqueConstantNmPerA ?? null, schema: platform.schema },
    parent: parent ? { id: parent.id, versionNo: parent.versionNo } : null,
    // Each review is written in the one transaction with its decision's event, so they pair in order.
    reviews: reviews.map((r, i) => { const view = reviewView(r); return { ...view, reviewer: asRecorded(decisions[i], view.reviewer) } }),
    history,
    liveEvaluation: evaluateOnServer(subject.spec, platform, v.parameters, settings)
  }
}

// A car's profiles, each with its versions newest first and the last review of each.
export async function listProfiles(user: SignedIn, vehicle: Vehicle): Promise<{ items: ProfileView[], total: number }> {
  const profiles = await Profile.findAll({
    where: { vehicleId: vehicle.id, workshopId: user.workshopId },
    include: [{ model: ProfileVersion, as: 'versions', include: [authorInclude, reviewsInclude] }],
    order: [['name', 'ASC'], [{ model: ProfileVersion, as: 'versions' }, 'versionNo', 'DESC']]
  })
  const [baselines, summaries] = await Promise.all([
    profileBaselines(profiles),
    withRecordedPeople(user.workshopId, profiles.flatMap(p => (p.versions ?? []).map(versionSummary)))
  ])
  const summaryOf = new Map(summaries.map(s => [s.id, s]))
  const items = profiles.map(p => ({
    id: p.id, vehicleId: vehicle.id, name: p.name, onCarVersionId: p.onCarVersionId,
    versions: (p.versions ?? []).map(v => summaryOf.get(v.id)!), baseline: baselines.get(p.id) ?? null
  }))
  return { items, total: items.length }
}
