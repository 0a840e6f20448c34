// The order a tuner works through a controller's settings, by what each stands for (its role); settings the
// physics does not use (switches, modes, maps and the like) go under "Other settings".
import { settingKind, type LooseProperty } from '~~/shared/compute/setting-kinds'
import type { Role } from '~~/shared/compute/roles'

export interface ParameterGroup { id: string, title: string, roles: readonly Role[] }
export interface TuneGroup { id: string, title: string, names: string[] }

export const parameterGroups: readonly ParameterGroup[] = [
  { id: 'drive', title: 'Drive', roles: ['powerCap', 'torqueCap', 'throttleProgression', 'speedLimit', 'reverseSpeedLimit'] },
  { id: 'regen', title: 'Regenerative braking', roles: ['regenTorqueLimit', 'liftOffRegen', 'brakeRegen'] },
  { id: 'creep', title: 'Creep', roles: ['creepTorque', 'creepSpeed'] },
  { id: 'currents', title: 'Battery currents', roles: ['batteryDischargeLimit', 'batteryChargeLimit'] },
  { id: 'thermal', title: 'Thermal derating', roles: ['motorDerateStart', 'motorCutoff', 'inverterDerateStart', 'inverterCutoff', 'batteryDerateStart', 'batteryCutoff'] }
]

// The schema's settings in their groups, each group in role order; empty groups are left out.
export function groupSettings(properties: Record<string, LooseProperty>): TuneGroup[] {
  const byRole = new Map<string, string>()
  for (const [name, p] of Object.entries(properties)) if (typeof p?.['x-role'] === 'string' && !byRole.has(p['x-role'])) byRole.set(p['x-role'], name)
  const groups = parameterGroups
    .map(g => ({ id: g.id, title: g.title, names: g.roles.flatMap(r => byRole.get(r) ?? []) }))
    .filter(g => g.names.length)
  const listed = new Set(groups.flatMap(g => g.names))
  const other = Object.keys(properties).filter(n => !listed.has(n) && settingKind(properties[n]) !== undefined)
  if (other.length) groups.push({ id: 'other', title: 'Other settings', names: other })
  return groups
}
