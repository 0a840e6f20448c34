import { staffRoles, type Role } from '../schemas/roles'

// Who may do what, by role: one map read by the server's guards, the pages' route meta and the menu
// (docs/architecture.md#roles). The four-eyes rule is about people, not roles: it lives in the version
// lifecycle, not here.
export const permissions = {
  // Everyone who works on cars: read cars, versions, road tests, snags, read-backs and a car's history.
  'staff': staffRoles,
  'people.manage': ['admin'],
  'workshop.configure': ['admin'],
  'platforms.upload': ['admin'],
  'cars.write': ['admin', 'tuner', 'engineer'],
  'versions.write': ['tuner'],
  'versions.review': ['engineer'],
  'road-tests.record': ['tester'],
  'readbacks.record': ['tuner', 'tester'],
  'snags.write': ['admin', 'tuner', 'engineer', 'tester'],
  'activity.read': ['auditor', 'admin', 'engineer'],
  'fleet.recheck': ['admin', 'engineer'],
  'history.verify': ['auditor', 'admin']
} as const satisfies Record<string, readonly Role[]>

export type Permission = keyof typeof permissions

export function can(roles: readonly string[], permission: Permission): boolean {
  const allowed: readonly string[] = permissions[permission]
  return roles.some(r => allowed.includes(r))
}

export function rolesFor(permission: Permission): readonly Role[] {
  return permissions[permission]
}
