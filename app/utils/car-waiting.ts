// What waits on whom for one car, read from its versions, snags and drift; the step for the person
// looking comes first. Pure, so the overview and its test read it the same way.
import type { ProfileView } from '~~/shared/schemas/profile-views'
import type { Permission } from '~~/shared/utils/permissions'

export interface WaitingItem { who: string, what: string, to: string, mine: boolean }
interface CarFacts { id: number, driftedAt: Date | string | null }

export function carWaiting(car: CarFacts, profiles: ProfileView[], snags: { open: number, blocking: number }, can: (p: Permission) => boolean): WaitingItem[] {
  const items: WaitingItem[] = []
  for (const p of profiles) {
    for (const v of p.versions) {
      const name = `${p.name} v${v.versionNo}`
      const page = `/versions/${v.id}`
      if (v.state === 'in-review') items.push({ who: 'An engineer', what: `review ${name}`, to: page, mine: can('versions.review') })
      else if (v.state === 'approved') items.push({ who: 'A road tester', what: `road-test ${name}`, to: `/road-tests/new?version=${v.id}`, mine: can('road-tests.record') })
      else if (v.state === 'draft') items.push({ who: v.author?.name ?? 'Its author', what: `finish the draft ${name} and send it for review`, to: page, mine: can('versions.write') })
      else if (v.state === 'rejected') items.push({ who: v.author?.name ?? 'Its author', what: `rework ${name}, sent back${v.lastReview?.reviewer ? ` by ${v.lastReview.reviewer.name}` : ''}`, to: page, mine: can('versions.write') })
    }
  }
  if (snags.blocking) items.push({ who: 'The workshop', what: `clear ${snags.blocking} snag${snags.blocking === 1 ? '' : 's'} that block${snags.blocking === 1 ? 's' : ''} sign-off`, to: `/cars/${car.id}/snags`, mine: can('snags.write') })
  if (car.driftedAt) items.push({ who: 'A tuner or tester', what: 'put the signed-off settings back on the controller and read it back', to: `/cars/${car.id}/readbacks`, mine: can('readbacks.record') })
  return [...items.filter(i => i.mine), ...items.filter(i => !i.mine)]
}
