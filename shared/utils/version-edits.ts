// A draft's edit as the version page's review history tells it: each setting by its title with its new value
// in words ("Power cap: 80 kW; Lift-off regen: 25 %"), a long text named as reworded rather than quoted.
import type { PatchOp } from './audit-changes'
import { changePathLabel } from './audit-actions'
import { unitOf, valueText } from './audit-values'

const valueOf = (p: PatchOp, key: string) => p.op === 'remove' ? 'removed' : typeof p.value === 'string' && p.value.length > 40 ? 'reworded' : valueText(p.value, key)
// The unit goes with the value where the field's name carries one, so the label drops its own ", kW".
function line(p: PatchOp): string {
  const key = p.path.split('/').pop() ?? ''
  const label = changePathLabel(p.path, 'version')
  return `${unitOf(key) ? label.replace(/, \S+$/, '') : label}: ${valueOf(p, key)}`
}

export function versionEditText(patch: unknown): string {
  if (!Array.isArray(patch)) return ''
  return (patch as PatchOp[]).filter(p => p.op !== 'test').map(line).join('; ')
}
