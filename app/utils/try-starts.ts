// Where "Try settings" may start from: each profile's settings on the car (said as signed off when the car has
// drifted, for the controller may no longer hold them), and each profile's latest version that is not on it
// yet (awaiting its road test, in review, a draft or sent back), so a tester can try what they are about to drive.
import type { ProfileView } from '~~/shared/schemas/profile-views'
import { latestVersion } from './car-waiting'

export interface TryStart { versionId: number, label: string, started: string, onCar: boolean }

const stateWords: Partial<Record<string, string>> = { 'approved': 'awaiting its road test', 'in-review': 'in review', 'draft': 'a draft', 'rejected': 'sent back' }

export function tryStarts(profiles: readonly ProfileView[], drifted: boolean): TryStart[] {
  const onCar = profiles.flatMap((p) => {
    const v = p.versions.find(x => x.id === p.onCarVersionId)
    if (!v) return []
    const name = `${p.name} v${v.versionNo}`
    return [drifted
      ? { versionId: v.id, label: `${name}, as signed off`, started: `${name} as signed off onto the car (the last read-back of the controller differed from it)`, onCar: true }
      : { versionId: v.id, label: `${name}, on the car`, started: `${name}, on the car`, onCar: true }]
  })
  const coming = profiles.flatMap((p) => {
    const v = latestVersion(p.versions)
    const words = v && v.id !== p.onCarVersionId ? stateWords[v.state] : undefined
    return v && words ? [{ versionId: v.id, label: `${p.name} v${v.versionNo}, ${words}`, started: `${p.name} v${v.versionNo}, ${words}`, onCar: false }] : []
  })
  return [...onCar, ...coming]
}
