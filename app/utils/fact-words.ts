// Which fact an evaluation problem is about, in the workshop's words: "spec.tyreSizeRear" reads "Rear tyre
// size, if different", never the path itself (docs/computation.md lists where each fact comes from).
import { settingLimits } from '~~/shared/compute/settings'
import { specGroups } from '~~/shared/schemas/vehicle-spec-fields'

const specLabels: Record<string, string> = Object.fromEntries(specGroups.flatMap(g => g.fields).map(f => [f.key, f.label]))
const limitNames: Record<string, string> = Object.fromEntries(Object.entries(settingLimits).map(([path, l]) => [path, l.name]))

export function factWords(path: string, titles: Record<string, { title?: unknown }> = {}): string {
  const [head = '', ...rest] = path.split('.')
  const key = rest.join('.')
  if (head === 'spec') return specLabels[rest[0] ?? ''] ?? 'A car fact'
  if (head === 'settings') return limitNames[key] ?? 'The workshop\'s settings'
  if (head === 'platform') return 'The drive unit'
  if (head === 'parameters') {
    const title = titles[rest[0] ?? '']?.title
    return typeof title === 'string' ? title : 'A setting this drive unit does not have'
  }
  return 'A fact'
}
