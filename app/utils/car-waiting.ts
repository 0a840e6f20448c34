// What waits on whom for one car, read from its versions, snags and drift; the step for the person
// looking comes first. Pure, so the overview and its test read it the same way.
import type { ProfileView, VersionSummary } from '~~/shared/schemas/profile-views'
import type { Permission } from '~~/shared/utils/permissions'

export interface WaitingItem { who: string, what: string, to: string, mine: boolean }
interface CarFacts { id: number, driftedAt: Date | string | null }

// The version of a profile a next step may point at: its latest, a withdrawn one aside (taking a version back
// leaves the one before it standing). An earlier version sent back or awaiting a test has been overtaken.
export function latestVersion<V extends Pick<VersionSummary, 'versionNo' | 'state'>>(versions: readonly V[]): V | null {
  return versions.filter(v => v.state !== 'withdrawn').reduce<V | null>((a, v) => (a && a.versionNo > v.versionNo ? a : v), null)
}

// The step a profile waits on, read from its latest version; none once it is signed off or superseded.
function profileStep(p: ProfileView, can: (p: Permission) => boolean): WaitingItem | null {
  const v = latestVersion(p.versions)
  if (!v) return null
  const name = `${p.name} v${v.versionNo}`
  const page = `/versions/${v.id}`
  if (v.state === 'in-review') return { who: 'An engineer', what: `review ${name}`, to: page, mine: can('versions.review') }
  if (v.state === 'approved') return { who: 'A road tester', what: `road-test ${name}`, to: `/road-tests/new?version=${v.id}`, mine: can('road-tests.record') }
  if (v.state === 'draft') return { who: v.author?.name ?? 'Its author', what: `finish the draft ${name} and send it for review`, to: page, mine: can('versions.write') }
  if (v.state === 'rejected') return { who: v.author?.name ?? 'Its author', what: `rework ${name}, sent back${v.lastReview?.reviewer ? ` by ${v.lastReview.reviewer.name}` : ''}`, to: page, mine: can('versions.write') }
  return null
}

export function carWaiting(car: CarFacts, profiles: ProfileView[], snags: { open: number, blocking: number }, can: (p: Permission) => boolean): WaitingItem[] {
  const items = profiles.map(p => profileStep(p, can)).filter((i): i is WaitingItem => i !== null)
  if (snags.blocking) items.push({ who: 'The workshop', what: `clear ${snags.blocking} snag${snags.blocking === 1 ? '' : 's'} that block${snags.blocking === 1 ? 's' : ''} sign-off`, to: `/cars/${car.id}/snags`, mine: can('snags.write') })
  if (car.driftedAt) items.push({ who: 'A tuner or tester', what: 'put the signed-off settings back on the controller and read it back', to: `/cars/${car.id}/readbacks`, mine: can('readbacks.record') })
  return [...items.filter(i => i.mine), ...items.filter(i => !i.mine)]
}
