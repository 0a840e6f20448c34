// What a person must never read on a screen or in the history: the product's own codes and field names.
// Shared by the history-in-words unit test and the browser test that reads every main page.
import { mandatoryCheckKeys, checkVerdicts } from '../../shared/schemas/road-test'
import { ruleTitles } from '../../shared/compute/rule-titles'
import { versionStates } from '../../shared/schemas/version'
import { vehicleStatuses } from '../../shared/schemas/vehicle'
import { snagStatuses } from '../../shared/schemas/snag'
import { auditActionLabels } from '../../shared/utils/audit-actions'
import { platforms } from '../../shared/platforms'

// Codes of more than one word ("lift-off-regen", "road-testing", "version.signed-off"): a plain word such as
// "draft" or "pass" is also English, a joined code is not. A two-word check or rule key ("hill-start",
// "creep-hold") is also how the workshop writes a compound ("the minimum hill-start gradient"), so only the
// longer ones count; states, stages and action codes count whole.
const longKeys = [...mandatoryCheckKeys, ...Object.keys(ruleTitles)].filter(c => c.split('-').length > 2)
const states = [...checkVerdicts, ...versionStates, ...vehicleStatuses, ...snagStatuses].filter(c => c.includes('-') && c !== 'signed-off') // "the signed-off settings"
export const codeWords = [...new Set<string>([...longKeys, ...states, ...Object.keys(auditActionLabels), 'pass-fail'])]

const codePattern = new RegExp(`(?<![\\w.-])(${codeWords.map(c => c.replace(/[.-]/g, m => `\\${m}`)).join('|')})(?![\\w-])`)
const CAMEL = /\b(?!kWh?\b)[a-z]+[A-Z][A-Za-z]*\b/ // a field name; kW and kWh are units
const LEFT_OVER = /\b(undefined|NaN|null)\b|\[object Object\]/

const escape = (c: string) => c.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
// A drive unit's short code ("quennel-95"), and anything shaped like one: letters, a hyphen, a number. The
// manager's page of drive units shows them on purpose, labelled as such; nowhere else should.
const shortCodes = platforms.map(p => p.key).map(escape).join('|')
const SHORT_NAME = new RegExp(`(?<![\\w-])(${shortCodes}|[a-z]+-\\d+)(?![\\w-])`)

// The first internal name in the text, with a little of what surrounds it, or undefined. `extra`: codes of the
// workshop's own, such as its road-test checks' keys; `shortCodes: false` where drive units' codes are shown.
export function internalNameIn(text: string, extra: string[] = [], { shortCodes: withShortCodes = true } = {}): string | undefined {
  const own = extra.filter(c => c.includes('-')) // the workshop's own keys are never how it writes a word
  const ownPattern = own.length ? new RegExp(`(?<![\\w.-])(${own.map(escape).join('|')})(?![\\w-])`) : null
  for (const re of [codePattern, ownPattern, withShortCodes ? SHORT_NAME : null, CAMEL, LEFT_OVER]) {
    if (!re) continue
    const m = re.exec(text)
    if (m) return text.slice(Math.max(0, m.index - 30), m.index + m[0].length + 30)
  }
  return undefined
}
