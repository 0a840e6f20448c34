// What waits on whom for one car, read from its versions, snags and drift; the step for the person
// looking comes first. A step is "mine" only when it falls to me: the author's draft, a review or road test
// I may give (not of my own version), a snag assigned to me. Pure, so the overview and its test read it alike.
import type { PersonRef, ProfileView, VersionSummary } from '~~/shared/schemas/profile-views'
import type { Permission } from '~~/shared/utils/permissions'

// `who` is said after "Waits on" to everyone but the person it falls to.
export interface WaitingItem { who: string, what: string, to: string, mine: boolean }
export interface Viewer { id: number | null, can: (p: Permission) => boolean }
interface CarFacts { id: number, driftedAt: Date | string | null }
interface BlockingSnag { assignee: PersonRef | null }

// The version of a profile a next step may point at: its latest, a withdrawn one aside (taking a version back
// leaves the one before it standing). An earlier version sent back or awaiting a test has been overtaken.
export function latestVersion<V extends Pick<VersionSummary, 'versionNo' | 'state'>>(versions: readonly V[]): V | null {
  return versions.filter(v => v.state !== 'withdrawn').reduce<V | null>((a, v) => (a && a.versionNo > v.versionNo ? a : v), null)
}

// Review and sign-off go to someone other than the version's author (docs/version-lifecycle.md).
const notTheAuthor = (role: string, author: PersonRef | null, me: Viewer) => (author ? `${role} other than ${author.id === me.id ? 'you' : author.name}` : role)

// The step a profile waits on, read from its latest version; none once it is signed off or superseded.
function profileStep(p: ProfileView, me: Viewer): WaitingItem | null {
  const v = latestVersion(p.versions)
  if (!v) return null
  const name = `${p.name} v${v.versionNo}`
  const page = `/versions/${v.id}`
  const mineAsAuthor = v.author !== null && v.author.id === me.id
  if (v.state === 'in-review') return { who: notTheAuthor('an engineer', v.author, me), what: `review ${name}`, to: page, mine: me.can('versions.review') && !mineAsAuthor }
  if (v.state === 'approved') return { who: notTheAuthor('a road tester', v.author, me), what: `road-test ${name}`, to: `/road-tests/new?version=${v.id}`, mine: me.can('road-tests.record') && !mineAsAuthor }
  const author = v.author?.name ?? 'its author'
  const mine = mineAsAuthor && me.can('versions.write')
  if (v.state === 'draft') return { who: author, what: `finish the draft ${name} and send it for review`, to: page, mine }
  if (v.state === 'rejected') return { who: author, what: `rework ${name}, sent back${v.lastReview?.reviewer ? ` by ${v.lastReview.reviewer.name}` : ''}`, to: page, mine }
  return null
}

// Blocking snags, one step per person they are assigned to; those assigned to nobody wait on someone being assigned.
function snagSteps(car: CarFacts, blocking: readonly BlockingSnag[], me: Viewer): WaitingItem[] {
  const groups = new Map<number | null, { who: string, count: number }>()
  for (const s of blocking) {
    const key = s.assignee?.id ?? null
    const group = groups.get(key) ?? { who: s.assignee?.name ?? 'someone being assigned', count: 0 }
    groups.set(key, { ...group, count: group.count + 1 })
  }
  return [...groups].map(([id, g]) => ({
    who: g.who,
    what: `clear ${g.count} snag${g.count === 1 ? '' : 's'} that block${g.count === 1 ? 's' : ''} sign-off`,
    to: `/cars/${car.id}/snags`,
    mine: id !== null && id === me.id
  }))
}

export function carWaiting(car: CarFacts, profiles: ProfileView[], blocking: readonly BlockingSnag[], me: Viewer): WaitingItem[] {
  const items = profiles.map(p => profileStep(p, me)).filter((i): i is WaitingItem => i !== null)
  // A car just booked in waits on a tuner to start its settings.
  if (!profiles.some(p => p.versions.length)) items.push({ who: 'a tuner', what: 'start the car\'s first profile of controller settings', to: `/cars/${car.id}/versions`, mine: me.can('versions.write') })
  items.push(...snagSteps(car, blocking, me))
  if (car.driftedAt) items.push({ who: 'a tuner or tester', what: 'put the signed-off settings back on the controller and read it back', to: `/cars/${car.id}/readbacks`, mine: me.can('readbacks.record') })
  return [...items.filter(i => i.mine), ...items.filter(i => !i.mine)]
}
