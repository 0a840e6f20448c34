import { Op, literal } from 'sequelize'
import { Kit, Profile, ProfileVersion, Vehicle, type Review } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { DraftWorkItem, EvaluationSnapshot, ReviewWorkItem } from '../../../shared/schemas/profile-views'
import { reviewView, authorInclude, reviewsInclude } from './views'

// The car a version is for, or the kit whose baseline it is.
const carInclude = { model: Profile, as: 'profile', attributes: ['id', 'name'], include: [
  { model: Vehicle, as: 'vehicle', attributes: ['id', 'stockRef', 'make', 'model', 'year'] }, { model: Kit, as: 'kit', attributes: ['id', 'name'] }
] }
type WithCar = ProfileVersion & { profile: Profile & { vehicle: Vehicle | null, kit: Kit | null } }
const car = ({ profile: { vehicle: c, kit } }: WithCar) => ({
  vehicle: c ? { id: c.id, stockRef: c.stockRef, make: c.make, model: c.model, year: c.year } : null,
  kit: kit ? { id: kit.id, name: kit.name } : null
})

// What waits for an engineer: versions in review, oldest first, with what the evaluation flagged.
export async function reviewWorklist(user: SignedIn): Promise<{ items: ReviewWorkItem[], total: number }> {
  const rows = await ProfileVersion.findAll({
    where: { workshopId: user.workshopId, state: 'in-review' },
    include: [authorInclude, carInclude],
    order: [['submittedAt', 'ASC'], ['id', 'ASC']]
  }) as WithCar[]
  const items = rows.map((v) => {
    const warnings = (v.evaluation as EvaluationSnapshot | null)?.warnings ?? []
    return {
      versionId: v.id, versionNo: v.versionNo, profileName: v.profile.name, ...car(v),
      author: v.author ? { id: v.author.id, name: v.author.name } : null, submittedAt: v.submittedAt ? v.submittedAt.toISOString() : null,
      dangerCount: warnings.filter(w => w.severity === 'danger').length, cautionCount: warnings.filter(w => w.severity === 'caution').length,
      ownVersion: v.authorId === user.id
    }
  })
  return { items, total: items.length }
}

// What waits for a tuner: their drafts, and their sent-back versions that no later version of the profile has
// overtaken (from whichever version it was started; a withdrawn one aside), as the car's overview reads it.
export async function draftWorklist(user: SignedIn): Promise<{ items: DraftWorkItem[], total: number }> {
  const noFollowUp = literal(`NOT EXISTS (SELECT 1 FROM profile_versions c WHERE c."profileId" = "ProfileVersion"."profileId"
    AND c."versionNo" > "ProfileVersion"."versionNo" AND c.state <> 'withdrawn')`)
  const rows = await ProfileVersion.findAll({
    where: { workshopId: user.workshopId, authorId: user.id, [Op.or]: [{ state: 'draft' }, { state: 'rejected', [Op.and]: [noFollowUp] }] },
    include: [carInclude, reviewsInclude],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']]
  }) as (WithCar & { reviews?: Review[] })[]
  const items = rows.map((v) => {
    const last = [...(v.reviews ?? [])].sort((a, b) => a.id - b.id).at(-1)
    return {
      versionId: v.id, versionNo: v.versionNo, profileName: v.profile.name, state: v.state, ...car(v),
      updatedAt: v.updatedAt.toISOString(), review: last ? reviewView(last) : null
    }
  })
  return { items, total: items.length }
}
