// The codes the software knows things by, which no one should read in the main text of a screen: the drive
// units' short names, the checks' and the safety rules' ids, the states written with a hyphen. Codes that are
// also plain English ("a hill-start", "the signed-off settings") are left out.
import { platforms } from '../../shared/platforms'
import { RULE_IDS } from '../../shared/compute/types'
import { mandatoryCheckKeys, checkVerdicts } from '../../shared/schemas/road-test'
import { versionStates } from '../../shared/schemas/version'
import { snagStatuses } from '../../shared/schemas/snag'
import { vehicleStatuses } from '../../shared/schemas/vehicle'

const ENGLISH = new Set(['hill-start', 'full-power', 'signed-off', 'stop-lamp', 'road-testing'])

export const INTERNAL_CODES = [...new Set([
  ...platforms.map(p => p.key), ...RULE_IDS, ...mandatoryCheckKeys, ...checkVerdicts, ...versionStates, ...snagStatuses, ...vehicleStatuses, 'pass-fail'
])].filter(c => c.includes('-') && !ENGLISH.has(c))

// The first code found as a word of its own in the text, with a little of what surrounds it.
export function internalCodeIn(text: string, extra: string[] = []): string | undefined {
  for (const code of [...INTERNAL_CODES, ...extra]) {
    const m = new RegExp(`.{0,20}(?<![\\w-])${code.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?![\\w-]).{0,20}`).exec(text)
    if (m) return m[0]
  }
  // A short name like a drive unit's: lower-case letters, a hyphen, a number ("quennel-95").
  return /.{0,20}(?<![\w-])[a-z]+-\d+(?![\w-]).{0,20}/.exec(text)?.[0]
}
