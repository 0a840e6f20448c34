import { z } from 'zod'

export const roles = ['admin', 'tuner', 'engineer', 'tester', 'auditor', 'client'] as const
export type Role = typeof roles[number]
export const roleSchema = z.enum(roles)

export const roleLabels: Record<Role, string> = {
  admin: 'Workshop manager',
  tuner: 'Tuner',
  engineer: 'Senior engineer',
  tester: 'Road tester',
  auditor: 'Auditor',
  client: 'Car owner'
}

// People who work on cars (everyone but the car's owner).
export const staffRoles: Role[] = ['admin', 'tuner', 'engineer', 'tester', 'auditor']
export const isStaff = (userRoles: readonly string[]) => userRoles.some(r => (staffRoles as string[]).includes(r))
