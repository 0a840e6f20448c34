import { describe, it, expect } from 'vitest'
import { carWaiting } from '../../app/utils/car-waiting'
import { can } from '../../shared/utils/permissions'
import type { ProfileView, VersionSummary } from '../../shared/schemas/profile-views'

const version = (id: number, versionNo: number, state: VersionSummary['state']): VersionSummary => ({
  id, profileId: 1, versionNo, parentVersionId: null, state, origin: 'workshop', author: { id: 3, name: 'Dev Carrow' }, rationale: '', dangerCount: 0,
  submittedAt: null, decidedAt: null, createdAt: '2026-12-02T10:00:00Z', lastReview: null
})
const profiles: ProfileView[] = [{ id: 1, vehicleId: 9, name: 'Road', onCarVersionId: 1, versions: [version(1, 1, 'signed-off'), version(2, 2, 'in-review'), version(3, 3, 'approved')] }]

describe('what waits on whom for a car', () => {
  it('puts the step of the person looking first, and names who the rest wait on', () => {
    const tester = carWaiting({ id: 9, driftedAt: null }, profiles, { open: 2, blocking: 1 }, p => can(['tester'], p))
    expect(tester[0]).toEqual({ who: 'A road tester', what: 'road-test Road v3', to: '/road-tests/new?version=3', mine: true })
    expect(tester.map(w => w.what)).toEqual(['road-test Road v3', 'clear 1 snag that blocks sign-off', 'review Road v2'])
    const engineer = carWaiting({ id: 9, driftedAt: '2026-12-02T10:00:00Z' }, profiles, { open: 0, blocking: 0 }, p => can(['engineer'], p))
    expect(engineer.filter(w => w.mine).map(w => w.what)).toEqual(['review Road v2'])
    expect(engineer.at(-1)!.what).toContain('read it back')
  })
})
