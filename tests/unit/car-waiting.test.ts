import { describe, it, expect } from 'vitest'
import { carWaiting } from '../../app/utils/car-waiting'
import { can } from '../../shared/utils/permissions'
import type { ProfileView, VersionSummary } from '../../shared/schemas/profile-views'

const version = (id: number, versionNo: number, state: VersionSummary['state'], profileId = 1): VersionSummary => ({
  id, profileId, versionNo, parentVersionId: null, state, origin: 'workshop', roadTestId: null, author: { id: 3, name: 'Dev Carrow' }, rationale: '', dangerCount: 0,
  submittedAt: null, decidedAt: null, createdAt: '2026-12-02T10:00:00Z', lastReview: null
})
const profile = (id: number, name: string, versions: VersionSummary[]): ProfileView => ({ id, vehicleId: 9, name, onCarVersionId: null, versions, baseline: null })
const asRole = (role: string) => (p: Parameters<typeof can>[1]) => can([role], p)
const profiles = [
  profile(1, 'Road', [version(1, 1, 'signed-off'), version(2, 2, 'approved')]),
  profile(2, 'Track', [version(5, 1, 'in-review', 2)])
]

describe('what waits on whom for a car', () => {
  it('puts the step of the person looking first, and names who the rest wait on', () => {
    const tester = carWaiting({ id: 9, driftedAt: null }, profiles, { open: 2, blocking: 1 }, asRole('tester'))
    expect(tester[0]).toEqual({ who: 'A road tester', what: 'road-test Road v2', to: '/road-tests/new?version=2', mine: true })
    expect(tester.map(w => w.what)).toEqual(['road-test Road v2', 'clear 1 snag that blocks sign-off', 'review Track v1'])
    const engineer = carWaiting({ id: 9, driftedAt: '2026-12-02T10:00:00Z' }, profiles, { open: 0, blocking: 0 }, asRole('engineer'))
    expect(engineer.filter(w => w.mine).map(w => w.what)).toEqual(['review Track v1'])
    expect(engineer.at(-1)!.what).toContain('read it back')
  })

  it('points only at the latest version of each profile, never at one a later version has overtaken', () => {
    const later = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'approved'), version(3, 3, 'rejected'), version(4, 4, 'approved')])]
    const steps = carWaiting({ id: 9, driftedAt: null }, later, { open: 0, blocking: 0 }, asRole('tuner')).map(w => w.what)
    expect(steps).toEqual(['road-test Road v4'])
    // Signed off at the last: nothing waits, however many earlier versions were sent back.
    const done = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'signed-off')])]
    expect(carWaiting({ id: 9, driftedAt: null }, done, { open: 0, blocking: 0 }, asRole('tuner'))).toEqual([])
  })

  it('lets the version before a withdrawn one stand', () => {
    const withdrawn = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'withdrawn')])]
    expect(carWaiting({ id: 9, driftedAt: null }, withdrawn, { open: 0, blocking: 0 }, asRole('tuner'))).toEqual([
      { who: 'Dev Carrow', what: 'rework Road v1, sent back', to: '/versions/1', mine: true }
    ])
  })
})
