import type { Permission } from '../utils/permissions'
import { can } from '../utils/permissions'
import { versionStateLabels, type VersionState } from './version'

// The one table of what may happen to a version, in which state, by whom (docs/version-lifecycle.md).
// The server checks every change against it; the version page offers only what it allows.
export const versionActions = ['edit', 'submit', 'withdraw', 'approve', 'reject', 'road-test', 'roadside-change', 'sign-off', 'supersede'] as const
export type VersionAction = typeof versionActions[number]

// Who, as a person: the four-eyes rule is about people, so it lives here rather than in the permissions.
// `author` wrote the version; `not-author` did not; `driver` drove the road test the action is about.
export type PersonRule = 'author' | 'not-author' | 'driver'

export interface VersionTransition {
  action: VersionAction
  from: readonly VersionState[]
  // The state afterwards; the same as `from` for what a version allows without changing (edit, road test).
  to: VersionState | 'unchanged'
  // The role-based permission the route requires; none where the action only ever follows another one.
  permission: Permission | null
  // Each person rule the action has, with how its refusal reads.
  people: Partial<Record<PersonRule, string>>
  // How the refusal reads: "it cannot be …".
  doing: string
}

const fourEyes = 'Four eyes: the author of a version cannot review it. Another engineer must.'

export const versionLifecycle: Record<VersionAction, VersionTransition> = {
  'edit': { action: 'edit', from: ['draft'], to: 'unchanged', permission: 'versions.write', people: { author: 'Only the author of a draft can change it; start a new version from it instead.' }, doing: 'changed' },
  'submit': { action: 'submit', from: ['draft'], to: 'in-review', permission: 'versions.write', people: { author: 'Only the version\'s author can send it for review.' }, doing: 'sent for review' },
  'withdraw': { action: 'withdraw', from: ['draft', 'in-review'], to: 'withdrawn', permission: 'versions.write', people: { author: 'Only the version\'s author can withdraw it.' }, doing: 'withdrawn' },
  'approve': { action: 'approve', from: ['in-review'], to: 'approved', permission: 'versions.review', people: { 'not-author': fourEyes }, doing: 'approved' },
  'reject': { action: 'reject', from: ['in-review'], to: 'rejected', permission: 'versions.review', people: { 'not-author': fourEyes }, doing: 'sent back' },
  'road-test': { action: 'road-test', from: ['approved'], to: 'unchanged', permission: 'road-tests.record', people: {}, doing: 'road-tested' },
  // Settings changed while driving an approved version become a new version from it (origin roadside).
  'roadside-change': { action: 'roadside-change', from: ['approved'], to: 'unchanged', permission: 'road-tests.record', people: { driver: 'Only the tester who drove this road test can record a roadside change on it.' }, doing: 'changed at the roadside' },
  'sign-off': { action: 'sign-off', from: ['approved'], to: 'signed-off', permission: 'road-tests.record', people: { 'driver': 'Only the tester who drove this road test can sign it off.', 'not-author': 'You wrote this version: a tester who is not its author must road-test and sign it off.' }, doing: 'signed off' },
  // The previous on-car version, when another version of its profile is signed off.
  'supersede': { action: 'supersede', from: ['signed-off'], to: 'superseded', permission: null, people: {}, doing: 'superseded' }
}

export interface Actor { roles: readonly string[], isAuthor: boolean, isDriver?: boolean }

// The permission a route asks for before the table's person and state rules are checked.
export function routePermission(action: VersionAction): Permission {
  const permission = versionLifecycle[action].permission
  if (!permission) throw new Error(`Nobody asks for "${action}" directly: it follows another change.`)
  return permission
}

export const allowedFrom = (action: VersionAction, state: VersionState) => versionLifecycle[action].from.includes(state)

export function stateAfter(action: VersionAction, state: VersionState): VersionState {
  const to = versionLifecycle[action].to
  return to === 'unchanged' ? state : to
}

// The person rules the actor fails, in the table's order (empty when they may act).
export function failedPeopleRules(action: VersionAction, actor: Actor): PersonRule[] {
  return (Object.keys(versionLifecycle[action].people) as PersonRule[]).filter((rule) => {
    if (rule === 'author') return !actor.isAuthor
    if (rule === 'not-author') return actor.isAuthor
    return !actor.isDriver
  })
}

export function mayAct(action: VersionAction, state: VersionState, actor: Actor): boolean {
  const t = versionLifecycle[action]
  return allowedFrom(action, state) && (!t.permission || can(actor.roles, t.permission)) && failedPeopleRules(action, actor).length === 0
}

// What the page offers this person on a version in this state.
export function actionsFor(state: VersionState, actor: Actor): VersionAction[] {
  return versionActions.filter(a => a !== 'supersede' && mayAct(a, state, actor))
}

export function stateRefusal(action: VersionAction, state: VersionState, versionNo: number): string | null {
  if (allowedFrom(action, state)) return null
  const t = versionLifecycle[action]
  return `Version ${versionNo} is ${state} (${versionStateLabels[state].toLowerCase()}); it cannot be ${t.doing}. Only a version that is ${t.from.join(' or ')} can.`
}

export function personRefusal(action: VersionAction, rule: PersonRule): string {
  return versionLifecycle[action].people[rule]!
}
