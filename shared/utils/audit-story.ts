// A history event as the workshop tells it: one sentence with its people, car, profile and version by name,
// the facts that go with it, a road test's checks, the changes as before → after, and for auditors the
// record numbers and hashes. Nothing in the main text is a field name, a code or raw JSON (docs/history.md).
import type { HistoryEntry } from '../schemas/history'
import { ruleTitles } from '../compute/rule-titles'
import { checkTitles } from '../schemas/road-test-checks'
import { measuredValues } from './check-measures'
import type { CheckKey } from '../schemas/road-test'
import { summaryRows } from '../telemetry/summary-rows'
import { findPlatform } from '../platforms'
import { changePathLabel } from './audit-actions'
import { bytesText, keyLabel, numberText, stageWords, unitOf, valueText, wordsOf } from './audit-values'
import { knownChangeLabel, knownChangeRank } from './change-labels'
import { fitsText, type KitFit } from '../schemas/kit'
import { auditorLabel, auditorRows, isAuditorKey, recordNumberPath } from './audit-auditors'
import { recheckReasonLabels, type RecheckReason } from '../schemas/fleet'
import { localeNumber } from './number-format'
import { preDriveText } from '../schemas/road-test-cautions'

export interface StoryRow { label: string, value: string }
export interface StoryCheck { title: string, verdict: string, measured: string }
export interface StoryChange { label: string, before: string | null, after: string, removed: boolean }
export interface EventStory { sentence: string, facts: StoryRow[], checks: StoryCheck[], changes: StoryChange[], created: boolean, auditors: StoryRow[] }

type Data = Record<string, unknown>
const str = (x: unknown) => (typeof x === 'string' ? x : undefined)
const num = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? x : undefined)
const obj = (x: unknown): Data => (x && typeof x === 'object' && !Array.isArray(x) ? x as Data : {})
const plural = (n: number, one: string, many = `${one}s`) => `${localeNumber(n)} ${n === 1 ? one : many}`

function versionName(e: HistoryEntry, d: Data): string {
  if (e.names.version) return e.names.version
  const profile = str(d.profileName) ?? str(d.profile)
  const no = num(d.versionNo)
  return profile && no ? `${profile} v${no}` : no ? `version ${no}` : 'a version'
}

// What the event says, beside the change itself, as sentences' worth of facts.
function sentenceOf(e: HistoryEntry, d: Data): string {
  const who = e.actor?.name ?? 'Voltwright'
  const ver = versionName(e, d)
  const after = obj(d.after)
  // What the event itself recorded comes first: a name looked up elsewhere is only for what it did not record.
  const snag = (e.action === 'snag.created' ? str(after.title) : undefined) ?? e.names.snag ?? str(after.title)
  const person = str(after.name) ?? str(d.name) ?? e.names.person
  switch (e.action) {
    case 'vehicle.created': {
      const car = [after.year ?? d.year, after.make ?? d.make, after.model ?? d.model].filter(Boolean).join(' ')
      const ref = str(after.stockRef) ?? str(d.stockRef) ?? e.vehicle?.stockRef
      const kit = str(d.kitName) ? ` from the kit ${d.kitName}${num(d.baselineVersionNo) ? `, on its baseline v${d.baselineVersionNo}` : ''}` : ''
      return `${who} booked in ${car || 'the car'}${ref ? ` as ${ref}` : ''}${kit}`
    }
    case 'vehicle.updated': return `${who} changed the car's facts`
    case 'vehicle.drift-cleared': return `${who} cleared the car's drift warning${e.names.version ? ` with ${e.names.version} signed off` : ''}`
    case 'vehicle.status-changed': return `${who} moved the car from ${stageWords(d.from)} to ${stageWords(d.to)}${e.names.version || str(d.because)?.startsWith('road test') ? ' on recording a road test' : ''}`
    case 'user.created': return `${who} added ${person ?? 'a person'} to the workshop${Array.isArray(after.roles) ? ` as ${valueText(after.roles, 'roles').toLowerCase()}` : ''}`
    case 'user.updated': return `${who} changed ${e.names.person ? `${e.names.person}'s` : 'a person\'s'} account${d.passwordChanged === true ? ' and set a new password' : ''}`
    case 'user.renamed': {
      const renamed = e.changes.find(c => c.path === '/name')
      return `${who} renamed ${renamed?.beforeKnown && typeof renamed.before === 'string' ? renamed.before : 'a person'} to ${person ?? 'a new name'}`
    }
    case 'user.roles-changed': return `${who} changed ${person ? `${person}'s` : 'a person\'s'} roles`
    case 'user.deactivated': return `${who} stood ${person ?? 'a person'} down: they can no longer sign in`
    case 'user.reactivated': return `${who} let ${person ?? 'a person'} sign in again`
    case 'user.password-changed': return `${who} set a new password for ${person ?? 'a person'}`
    case 'profile.created': return `${who} started the profile ${str(d.name) ?? str(after.name) ?? ''}`.trimEnd()
    case 'version.created': return `${who} drafted ${ver}${e.names.parentVersion ? ` from ${e.names.parentVersion}` : num(d.parentVersionNo) ? ` from v${d.parentVersionNo}` : ''}`
    case 'version.updated':
    case 'version.edited': return `${who} edited the draft ${ver}`
    case 'version.roadside-recorded': return `${who} changed settings at the roadside and recorded them as ${ver}${e.names.parentVersion ? `, from ${e.names.parentVersion}` : ''}; it awaits an engineer's review`
    case 'version.submitted': {
      const dangers = num(d.dangerCount) ?? 0
      return `${who} sent ${ver} for review${dangers ? ` with ${plural(dangers, 'danger warning')} justified` : ''}`
    }
    case 'version.withdrawn': return `${who} withdrew ${ver} from review`
    case 'version.approved': return `${who} approved ${ver}`
    case 'version.rejected': return `${who} sent ${ver} back to its author`
    case 'version.superseded': return `${ver} was superseded`
    case 'version.signed-off': {
      const moved = obj(d.vehicleStatus)
      const open = num(d.unresolvedSnags)
      const stage = moved.from && moved.to ? `; the car moved from ${stageWords(moved.from)} to ${stageWords(moved.to)}${open !== undefined ? ` with ${plural(open, 'snag')} open` : ''}` : ''
      return `${who} signed ${ver} off onto the car${stage}${e.names.supersededVersion ? `; it replaces ${e.names.supersededVersion}` : ''}`
    }
    case 'road-test.recorded': return `${who} recorded a road test of ${ver}${d.verdict ? `: ${d.verdict === 'pass' ? 'passed' : 'failed'}` : ''}`
    case 'road-test.signed': return `${who} signed the road test of ${ver}`
    case 'road-test.telemetry':
    case 'road-test.telemetry-uploaded': return `${who} uploaded the controller log${str(d.filename) ? ` ${d.filename}` : ''} for the road test of ${ver}`
    case 'road-test.photo-added': return `${who} added a photo to the road test of ${ver}`
    case 'snag.photo-added': return `${who} added a photo to the snag ${snag ? `“${snag}”` : ''}`.trimEnd()
    case 'snag.created': return `${who} raised the snag “${snag ?? 'untitled'}”${after.blocking === true ? ', which blocks sign-off' : ''}`
    case 'snag.updated': return `${who} changed the snag${snag ? ` “${snag}”` : ''}`
    case 'readback.matched': return `${who} read the controller: it holds ${ver} as signed off`
    case 'readback.differs': {
      const n = Array.isArray(d.differences) ? d.differences.length : 0
      return `${who} read the controller and found ${plural(n, 'setting')} not as in ${ver}: the car has drifted`
    }
    case 'workshop.settings-changed': return `${who} changed the workshop's settings`
    case 'platform.created': return `${who} added the drive unit ${str(after.name) ?? ''}`.trimEnd()
    case 'workshop-check.created': return `${who} added the road-test check ${str(after.label) ?? ''}`.trimEnd()
    case 'workshop-check.changed': return `${who} changed the road-test check ${str(after.label) ?? ''}`.trimEnd()
    case 'kit.created': return `${who} set up the conversion kit ${str(after.name) ?? ''}`.trimEnd()
    case 'kit.updated': return `${who} changed a conversion kit`
    case 'fleet.rechecked': {
      const n = Array.isArray(d.newWarnings) ? d.newWarnings.length : 0
      return `The fleet re-check evaluated ${ver} on the car again${n ? ` and found ${plural(n, 'warning')} it did not raise at sign-off` : ': no new warnings'}`
    }
    default: return `${who}: ${e.action.split('.').map(wordsOf).join(', ')}`
  }
}

// Keys a sentence or a section already tells, or that belong only to the auditors' part.
const told = new Set(['versionNo', 'profileName', 'profile', 'parentVersionNo', 'vehicleStatus', 'unresolvedSnags', 'dangerCount', 'from', 'to', 'because',
  'passwordChanged', 'name', 'after', 'result', 'recheckId', 'verdict', 'checks', 'parameters', 'patchFromParent', 'filename', 'matches', 'stockRef', 'make', 'model', 'year', 'signed',
  'kitName', 'baselineVersionNo'])

// "Regen against grip, snow (2 × danger and caution); Stop lamps and regen (UN R13-H) (caution)": one rule's
// warnings once, the worst first.
const worst = ['danger', 'caution', 'info']
function warningsText(list: Data[]): string {
  const byRule = new Map<string, string[]>()
  for (const w of list) byRule.set(String(w.rule), [...(byRule.get(String(w.rule)) ?? []), String(w.severity)])
  return [...byRule].map(([rule, severities]) => {
    const counts = [...new Set(severities)].sort((a, b) => worst.indexOf(a) - worst.indexOf(b)).map((s) => {
      const n = severities.filter(x => x === s).length
      const word = s === 'info' ? 'note' : s
      return n > 1 ? `${n} × ${word}` : word
    })
    return `${ruleTitles[rule as keyof typeof ruleTitles]?.title ?? wordsOf(rule)} (${counts.length > 1 ? `${counts.slice(0, -1).join(', ')} and ${counts.at(-1)}` : counts[0]})`
  }).join('; ')
}

// "Lift-off regen: 25 % signed off, 50 % found"
function differenceText(x: Data): string {
  const label = knownChangeLabel('version', `/parameters/${x.parameter}`) ?? keyLabel(String(x.parameter))
  const [name, unit] = label.includes(', ') ? [label.slice(0, label.lastIndexOf(', ')), label.slice(label.lastIndexOf(', ') + 2)] : [label, '']
  const value = (y: unknown) => (typeof y === 'number' && unit ? `${numberText(y)} ${unit}` : valueText(y ?? null))
  return `${name}: ${value(x.expected)} signed off, ${value(x.found)} found`
}

function factsOf(e: HistoryEntry, d: Data): StoryRow[] {
  const facts: StoryRow[] = []
  const add = (label: string, value: string) => facts.push({ label, value })
  for (const [k, v] of Object.entries(d)) {
    if (told.has(k) || isAuditorKey(k) || v === null || v === undefined) continue
    if (k === 'conditions') {
      const c = obj(v)
      add('Conditions', [valueText(c.surface, 'surface'), valueText(c.ambientC, 'ambientC'), str(c.route)].filter(Boolean).join(', '))
    } else if ((k === 'warnings' || k === 'newWarnings') && Array.isArray(v)) {
      add(k === 'warnings' ? 'Warnings' : 'New warnings', warningsText(v.map(obj)) || 'none')
    } else if (k === 'justifications') {
      for (const [rule, text] of Object.entries(obj(v))) add(`Why it is safe: ${ruleTitles[rule as keyof typeof ruleTitles]?.title ?? wordsOf(rule)}`, valueText(text))
    } else if (k === 'differences' && Array.isArray(v)) {
      add('Differences', v.map(differenceText).join('; ') || 'none')
    } else if (k === 'summary') {
      summaryRows(obj(v)).forEach(r => add(r.label, r.value))
    } else if (k === 'bytes' && num(v) !== undefined) {
      add('Size', bytesText(v as number))
    } else if (k === 'width' || k === 'height') {
      if (k === 'width' && num(d.height)) add('Picture', `${v} × ${d.height} px`)
    } else if (k === 'reason' || k === 'comment' || k === 'caption' || k === 'rationale') {
      // A fleet re-check's reason is a code: said in words, capitalised.
      const words = e.action === 'fleet.rechecked' && k === 'reason' ? recheckReasonLabels[v as RecheckReason] : undefined
      if (v !== '') add({ reason: 'Reason', comment: 'Comment', caption: 'Caption', rationale: 'Why' }[k], words ? `${words[0]!.toUpperCase()}${words.slice(1)}` : valueText(v))
    } else if (k === 'preDrive') add('Before setting off', preDriveText(v, e.actor?.name ?? ''))
    else if (k === 'source') add('Came in as', valueText(v, 'source'))
    else if (k === 'readAt') add('Read from the controller', valueText(v))
    else if (k === 'origin') add('Made', valueText(v, 'origin'))
    else add(keyLabel(k), valueText(v, k))
  }
  if (e.action === 'version.signed-off' && num(d.unresolvedSnags) !== undefined) add('Snags open at sign-off', valueText(d.unresolvedSnags))
  return facts
}

function checksOf(d: Data): StoryCheck[] {
  if (!Array.isArray(d.checks)) return []
  return d.checks.map((c: Data) => ({
    title: checkTitles[c.key as CheckKey] ?? wordsOf(String(c.key)),
    verdict: valueText(c.verdict, 'verdict'),
    measured: measuredValues(String(c.key), obj(c.values)).join(', ')
  }))
}

// A creation's first state, from its rows, so the sentence can name what was created.
function createdState(e: HistoryEntry): Data {
  return Object.fromEntries(e.changes.filter(c => c.op === 'add' && /^\/[^/]+$/.test(c.path)).map(c => [c.path.slice(1), c.after]))
}

// A drive unit's settings by their titles, rather than its whole schema.
function platformSettings(e: HistoryEntry): StoryRow[] {
  const titles = e.changes.filter(c => /^\/schema\/properties\/[^/]+\/title$/.test(c.path)).map(c => String(c.after))
  return titles.length ? [{ label: 'Settings', value: titles.join(', ') }] : []
}

export function eventStory(e: HistoryEntry): EventStory {
  const d: Data = { ...e.details, after: createdState(e) }
  const people = e.names.people
  const checkUnit = str(obj(d.after).unit) ?? str(e.changes.find(c => c.path === '/unit')?.after)
  const created = /\.created$/.test(e.action) && e.changes.length > 0 && e.changes.every(c => c.op === 'add' && c.before === undefined)
  const changeValue = (v: unknown, path: string) => {
    const key = path.split('/').pop() ?? ''
    if ((key === 'assigneeId' || key === 'ownerUserId') && v !== null && v !== undefined) return people[String(v)] ?? 'someone no longer listed'
    if (key === 'platformKey' && typeof v === 'string') return findPlatform(v)?.name ?? v
    if (key === 'platformKeys' && (Array.isArray(v) || v === null)) return v?.length ? v.map(k => findPlatform(String(k))?.name ?? String(k)).join(', ') : 'every drive unit'
    if (key === 'fits' && Array.isArray(v)) return v.length ? fitsText(v as KitFit[]) : 'no cars listed'
    // A road-test check's limits in the check's own unit.
    if (e.entityType === 'workshop-check' && (key === 'min' || key === 'max') && typeof v === 'number') return `${numberText(v)}${checkUnit ? ` ${checkUnit}` : ''}`
    // The unit goes with the value unless the field's label already names it ("Power cap, kW").
    const label = knownChangeLabel(e.entityType, path)
    return valueText(v, label && /, \S+$/.test(label) && unitOf(key) ? '' : key)
  }
  return {
    sentence: `${sentenceOf(e, d)}.`,
    facts: [...factsOf(e, d), ...(e.action === 'platform.created' ? platformSettings(e) : [])],
    checks: checksOf(d),
    changes: e.changes.filter(c => !(e.action === 'platform.created' && c.path.startsWith('/schema')) && !codePath(e, c.path) && !recordNumberPath(c.path) && !(created && unsetCheckLimit(e, c.path, c.after)))
      .sort((a, b) => knownChangeRank(e.entityType, a.path) - knownChangeRank(e.entityType, b.path)).map(c => ({
      label: changePathLabel(c.path, e.entityType),
      before: c.beforeKnown ? changeValue(c.before, c.path) : null,
      after: c.op === 'remove' ? 'removed' : changeValue(c.after, c.path),
      removed: c.op === 'remove'
    })),
    created,
    auditors: [...auditorRows(e), ...e.changes.filter(c => codePath(e, c.path) && c.op !== 'remove').map(c => ({ label: 'Short code', value: String(c.after) })),
      ...e.changes.filter(c => recordNumberPath(c.path) && c.after !== null && c.after !== undefined && !(c.path.slice(1) in e.details)).map(c => ({ label: auditorLabel(c.path.slice(1)), value: String(c.after) }))]
  }
}

// A pass-or-fail check is created with no limits or unit: nothing to say about them.
const unsetCheckLimit = (e: HistoryEntry, path: string, v: unknown) => e.entityType === 'workshop-check' && ['/min', '/max', '/unit'].includes(path) && v === null

// A drive unit's or a check's short code is how the software knows it, not how people name it: for auditors only.
const codePath = (e: HistoryEntry, path: string) => path === '/key' && (e.entityType === 'platform' || e.entityType === 'workshop-check')
