import { describe, expect, it } from 'vitest'
import { versionStates, type VersionState } from '../../shared/schemas/version'
import { actionsFor, allowedFrom, failedPeopleRules, mayAct, personRefusal, routePermission, stateAfter, stateRefusal, versionActions, versionLifecycle, type VersionAction } from '../../shared/schemas/version-lifecycle'

const tuner = { roles: ['tuner'], isAuthor: true }
const engineer = { roles: ['engineer'], isAuthor: false }
const tester = { roles: ['tester'], isAuthor: false, isDriver: true }

describe('the version lifecycle table', () => {
  it('has one row per action, each naming its own action and leaving only from known states to known states', () => {
    expect(Object.keys(versionLifecycle)).toEqual([...versionActions])
    for (const [action, t] of Object.entries(versionLifecycle)) {
      expect(t.action).toBe(action)
      expect(t.from.length).toBeGreaterThan(0)
      for (const s of t.from) expect(versionStates).toContain(s)
      if (t.to !== 'unchanged') expect(versionStates).toContain(t.to)
    }
  })

  it('gives the workshop\'s way through review: draft → in review → approved → signed off → superseded', () => {
    const path: [VersionAction, VersionState][] = [['submit', 'in-review'], ['approve', 'approved'], ['sign-off', 'signed-off'], ['supersede', 'superseded']]
    let state: VersionState = 'draft'
    for (const [action, to] of path) {
      expect(allowedFrom(action, state)).toBe(true)
      state = stateAfter(action, state)
      expect(state).toBe(to)
    }
    expect(stateAfter('reject', 'in-review')).toBe('rejected')
    expect(stateAfter('withdraw', 'draft')).toBe('withdrawn')
    expect(stateAfter('withdraw', 'in-review')).toBe('withdrawn')
    expect(stateAfter('edit', 'draft')).toBe('draft')
    expect(stateAfter('road-test', 'approved')).toBe('approved')
  })

  it('leaves rejected, withdrawn and superseded versions for good: nothing leads out of them', () => {
    for (const end of ['rejected', 'withdrawn', 'superseded'] as const) {
      for (const action of versionActions) expect(allowedFrom(action, end)).toBe(false)
      expect(actionsFor(end, { roles: ['admin', 'tuner', 'engineer', 'tester'], isAuthor: true, isDriver: true })).toEqual([])
    }
  })

  it('never lets a version\'s content change after draft, nor a version be approved, road-tested or signed off from the wrong state', () => {
    for (const s of versionStates) {
      expect(allowedFrom('edit', s)).toBe(s === 'draft')
      expect(allowedFrom('approve', s)).toBe(s === 'in-review')
      expect(allowedFrom('road-test', s)).toBe(s === 'approved')
      expect(allowedFrom('roadside-change', s)).toBe(s === 'approved')
      expect(allowedFrom('sign-off', s)).toBe(s === 'approved')
    }
  })

  it('keeps four eyes on people: the author may not approve, reject or sign off, whatever roles they hold', () => {
    const everything = { roles: ['tuner', 'engineer', 'tester'], isAuthor: true, isDriver: true }
    expect(mayAct('approve', 'in-review', everything)).toBe(false)
    expect(mayAct('reject', 'in-review', everything)).toBe(false)
    expect(mayAct('sign-off', 'approved', everything)).toBe(false)
    expect(failedPeopleRules('approve', everything)).toEqual(['not-author'])
    expect(mayAct('approve', 'in-review', { ...everything, isAuthor: false })).toBe(true)
  })

  it('lets only the author edit, send and withdraw, and only the driver change settings at the roadside or sign off', () => {
    expect(actionsFor('draft', tuner)).toEqual(['edit', 'submit', 'withdraw'])
    expect(actionsFor('draft', { ...tuner, isAuthor: false })).toEqual([])
    expect(actionsFor('in-review', tuner)).toEqual(['withdraw'])
    expect(actionsFor('in-review', engineer)).toEqual(['approve', 'reject'])
    expect(actionsFor('approved', tester)).toEqual(['road-test', 'roadside-change', 'sign-off'])
    expect(actionsFor('approved', { ...tester, isDriver: false })).toEqual(['road-test'])
    expect(failedPeopleRules('sign-off', { ...tester, isDriver: false, isAuthor: true })).toEqual(['driver', 'not-author'])
  })

  it('asks for the role the route asks for: an engineer cannot send a draft, a tuner cannot approve', () => {
    expect(mayAct('submit', 'draft', { roles: ['engineer'], isAuthor: true })).toBe(false)
    expect(mayAct('approve', 'in-review', { roles: ['tuner'], isAuthor: false })).toBe(false)
    expect(mayAct('road-test', 'approved', { roles: ['auditor', 'admin'], isAuthor: false })).toBe(false)
    expect(actionsFor('in-review', { roles: ['auditor'], isAuthor: false })).toEqual([])
  })

  it('words each refusal with the state the version is in and the states that would do', () => {
    expect(stateRefusal('approve', 'in-review', 3)).toBeNull()
    expect(stateRefusal('approve', 'draft', 3)).toBe('Version 3 is draft (draft); it cannot be approved. Only a version that is in-review can.')
    expect(stateRefusal('withdraw', 'approved', 2)).toContain('Only a version that is draft or in-review can.')
    expect(personRefusal('sign-off', 'driver')).toBe('Only the tester who drove this road test can sign it off.')
    for (const t of Object.values(versionLifecycle)) {
      for (const rule of Object.keys(t.people) as (keyof typeof t.people)[]) expect(personRefusal(t.action, rule).length).toBeGreaterThan(20)
    }
  })
})

describe('the permission each route asks for', () => {
  it('comes from the table, and a change that only follows another one has no route', () => {
    expect(routePermission('submit')).toBe('versions.write')
    expect(routePermission('approve')).toBe('versions.review')
    expect(routePermission('roadside-change')).toBe('road-tests.record')
    expect(() => routePermission('supersede')).toThrow(/follows another change/)
  })
})
