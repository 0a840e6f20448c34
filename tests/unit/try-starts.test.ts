import { describe, it, expect } from 'vitest'
import { tryStarts } from '../../app/utils/try-starts'
import type { ProfileView, VersionSummary } from '../../shared/schemas/profile-views'

const version = (id: number, versionNo: number, state: VersionSummary['state']): VersionSummary => ({
  id, profileId: 1, versionNo, parentVersionId: null, state, origin: 'workshop', roadTestId: null, author: { id: 3, name: 'Dev Carrow' }, rationale: '', dangerCount: 0,
  submittedAt: null, decidedAt: null, createdAt: '2026-12-02T10:00:00Z', lastReview: null
})
const profile = (name: string, onCarVersionId: number | null, versions: VersionSummary[]): ProfileView => ({ id: 1, vehicleId: 9, name, onCarVersionId, versions, baseline: null })

describe('where "Try settings" may start from', () => {
  it('offers the settings on the car and the version awaiting its road test', () => {
    const starts = tryStarts([profile('Road', 1, [version(1, 1, 'signed-off'), version(2, 2, 'approved')])], false)
    expect(starts.map(s => [s.label, s.onCar])).toEqual([['Road v1, on the car', true], ['Road v2, awaiting its road test', false]])
  })

  it('says a drifted car\'s settings as signed off, never as on the car', () => {
    const starts = tryStarts([profile('Road', 1, [version(1, 1, 'signed-off'), version(2, 2, 'in-review')])], true)
    expect(starts.map(s => s.label)).toEqual(['Road v1, as signed off', 'Road v2, in review'])
    expect(starts[0]!.started).toMatch(/as signed off onto the car \(the last read-back of the controller differed from it\)/)
    expect(starts[0]!.label).not.toMatch(/on the car/)
  })

  it('offers nothing from a profile whose latest version is the one on the car, or was withdrawn to it', () => {
    expect(tryStarts([profile('Road', 1, [version(1, 1, 'signed-off')])], false).map(s => s.label)).toEqual(['Road v1, on the car'])
    expect(tryStarts([profile('Road', null, [version(1, 1, 'withdrawn')])], false)).toEqual([])
    expect(tryStarts([profile('Road', null, [version(1, 1, 'draft')])], false).map(s => s.label)).toEqual(['Road v1, a draft'])
  })
})
