import { describe, it, expect } from 'vitest'
import { carWaiting } from '../../app/utils/car-waiting'
import { can } from '../../shared/utils/permissions'
import type { ProfileView, VersionSummary } from '../../shared/schemas/profile-views'

const dev = { id: 3, name: 'Dev Carrow' }
const ida = { id: 7, name: 'Ida Penrose' }
const version = (id: number, versionNo: number, state: VersionSummary['state'], profileId = 1, author = dev): VersionSummary => ({
  id, profileId, versionNo, parentVersionId: null, state, origin: 'workshop', roadTestId: null, author, rationale: '', dangerCount: 0,
  submittedAt: null, decidedAt: null, createdAt: '2026-12-02T10:00:00Z', lastReview: null
})
const profile = (id: number, name: string, versions: VersionSummary[]): ProfileView => ({ id, vehicleId: 9, name, onCarVersionId: null, versions, baseline: null })
// Someone with these roles, signed in as person `id`.
const as = (id: number, ...roles: string[]) => ({ id, can: (p: Parameters<typeof can>[1]) => can(roles, p) })
const car = { id: 9, driftedAt: null }
const profiles = [
  profile(1, 'Road', [version(1, 1, 'signed-off'), version(2, 2, 'approved')]),
  profile(2, 'Track', [version(5, 1, 'in-review', 2)])
]
const said = (items: ReturnType<typeof carWaiting>) => items.map(w => (w.mine ? `mine: ${w.what}` : `${w.who}: ${w.what}`))

describe('what waits on whom for a car', () => {
  it('puts the step of the person looking first, and names who the rest wait on', () => {
    const tester = carWaiting(car, profiles, [{ assignee: ida }], as(20, 'tester'))
    expect(tester[0]).toEqual({ who: 'a road tester other than Dev Carrow', what: 'road-test Road v2', to: '/road-tests/new?version=2', mine: true })
    expect(said(tester)).toEqual(['mine: road-test Road v2', 'an engineer other than Dev Carrow: review Track v1', 'Ida Penrose: clear 1 snag that blocks sign-off'])
    const engineer = carWaiting({ id: 9, driftedAt: '2026-12-02T10:00:00Z' }, profiles, [], as(21, 'engineer'))
    expect(engineer.filter(w => w.mine).map(w => w.what)).toEqual(['review Track v1'])
    expect(engineer.at(-1)).toMatchObject({ who: 'a tuner or tester', mine: false })
    expect(engineer.at(-1)!.what).toContain('read it back')
  })

  it('gives a blocking snag to the person it is assigned to, and to nobody else', () => {
    const signedOff = [profile(1, 'Road', [version(1, 1, 'signed-off')])]
    const snags = [{ assignee: ida }, { assignee: ida }, { assignee: dev }, { assignee: null }]
    // Ida sees her own two as her step; the tuner who may edit snags is not told they are his.
    expect(said(carWaiting(car, signedOff, snags, as(ida.id, 'tester')))).toEqual([
      'mine: clear 2 snags that block sign-off', 'Dev Carrow: clear 1 snag that blocks sign-off', 'someone being assigned: clear 1 snag that blocks sign-off'
    ])
    const tuner = carWaiting(car, signedOff, snags, as(30, 'tuner', 'engineer', 'tester'))
    expect(tuner.some(w => w.mine)).toBe(false)
    expect(said(tuner)[0]).toBe('Ida Penrose: clear 2 snags that block sign-off')
    expect(carWaiting(car, signedOff, [{ assignee: null }], as(1, 'admin'))).toEqual([
      { who: 'someone being assigned', what: 'clear 1 snag that blocks sign-off', to: '/cars/9/snags', mine: false }
    ])
  })

  it('never gives the author the review or road test of their own version', () => {
    const lead = as(dev.id, 'tuner', 'engineer', 'tester')
    expect(carWaiting(car, profiles, [], lead).some(w => w.mine)).toBe(false)
    expect(said(carWaiting(car, profiles, [], lead))).toEqual(['a road tester other than you: road-test Road v2', 'an engineer other than you: review Track v1'])
    // Another engineer who is also a tester has both steps as theirs.
    expect(said(carWaiting(car, profiles, [], as(40, 'engineer', 'tester')))).toEqual(['mine: road-test Road v2', 'mine: review Track v1'])
  })

  it('leaves a draft or a sent-back version to its author, not to every tuner', () => {
    const drafts = [profile(1, 'Road', [version(1, 1, 'draft')]), profile(2, 'Track', [version(5, 1, 'rejected', 2, ida)])]
    expect(said(carWaiting(car, drafts, [], as(dev.id, 'tuner')))).toEqual(['mine: finish the draft Road v1 and send it for review', 'Ida Penrose: rework Track v1, sent back'])
    expect(said(carWaiting(car, drafts, [], as(50, 'tuner')))).toEqual(['Dev Carrow: finish the draft Road v1 and send it for review', 'Ida Penrose: rework Track v1, sent back'])
  })

  it('points only at the latest version of each profile, never at one a later version has overtaken', () => {
    const later = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'approved'), version(3, 3, 'rejected'), version(4, 4, 'approved')])]
    expect(carWaiting(car, later, [], as(20, 'tester')).map(w => w.what)).toEqual(['road-test Road v4'])
    // Signed off at the last: nothing waits, however many earlier versions were sent back.
    const done = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'signed-off')])]
    expect(carWaiting(car, done, [], as(dev.id, 'tuner'))).toEqual([])
  })

  it('a car just booked in, with no settings yet, waits on a tuner to start them', () => {
    expect(said(carWaiting(car, [], [], as(3, 'tuner')))).toEqual(['mine: start the car\'s first profile of controller settings'])
    expect(said(carWaiting(car, [profile(1, 'Road', [])], [], as(21, 'engineer')))).toEqual(['a tuner: start the car\'s first profile of controller settings'])
    expect(carWaiting(car, profiles, [], as(3, 'tuner')).some(w => w.what.includes('first profile'))).toBe(false)
  })

  it('lets the version before a withdrawn one stand', () => {
    const withdrawn = [profile(1, 'Road', [version(1, 1, 'rejected'), version(2, 2, 'withdrawn')])]
    expect(carWaiting(car, withdrawn, [], as(dev.id, 'tuner'))).toEqual([
      { who: 'Dev Carrow', what: 'rework Road v1, sent back', to: '/versions/1', mine: true }
    ])
  })
})
