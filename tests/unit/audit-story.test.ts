import { readFileSync, readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, it, expect } from 'vitest'
import { eventStory, type EventStory } from '../../shared/utils/audit-story'
import { auditActionLabels } from '../../shared/utils/audit-actions'
import { entryOf, legacySamples, samples } from './audit-story-fixtures'
import { creationRows } from '../../shared/utils/audit-changes'
import { internalNameIn } from './internal-names'
import { platforms } from '../../shared/platforms'
import { nameAt, type NameTimeline } from '../../server/utils/history/name-timeline'

// Every action the product writes, read from its writers: each `action:` of an audit event in server/ and seeders/.
function writtenActions(): Set<string> {
  const found = new Set<string>()
  const walk = (dir: string): string[] => readdirSync(dir).flatMap((f) => {
    const p = join(dir, f)
    return statSync(p).isDirectory() ? walk(p) : p.endsWith('.ts') ? [p] : []
  })
  for (const file of [...walk('server'), ...walk('seeders')]) {
    const text = readFileSync(file, 'utf8')
    if (!text.includes('appendAuditEvent') && !text.includes('story.add(')) continue
    for (const m of text.matchAll(/\baction: ([^\n]*?)(?:, entityType|,\s*$)/gm)) {
      expect(m[1], `${file}: an action written other than as quoted names`).not.toMatch(/`/)
      for (const q of m[1]!.matchAll(/'([a-z-]+\.[a-z-]+)'/g)) found.add(q[1]!)
    }
  }
  return found
}

// What a person sees of an event: everything but the part folded away for auditors.
const visible = (s: EventStory) => [s.sentence, ...s.facts.flatMap(f => [f.label, f.value]), ...s.checks.flatMap(c => [c.title, c.verdict, c.measured]),
  ...s.changes.flatMap(c => [c.label, c.before ?? 'not recorded', c.after])].join('\n')

const CAMEL = /\b(?!kWh?\b)[a-z]+[A-Z][A-Za-z]*\b/ // a field name; kW and kWh are units
const TOO_PRECISE = /\d\.\d{5,}/

describe('the history in the workshop\'s words', () => {
  const written = writtenActions()

  it('finds the actions the product writes, and has words and a sample for each', () => {
    expect(written.size).toBeGreaterThan(20)
    for (const action of written) {
      expect(auditActionLabels[action], `${action} has no label`).toBeTruthy()
      expect(samples[action], `${action} has no sample in tests/unit/audit-story-fixtures.ts`).toBeTruthy()
    }
  })

  it.each([...Object.entries(samples), ...Object.entries(legacySamples)])('%s reads as words: no field names, no JSON, no long decimals, no hashes', (action, sample) => {
    const entry = entryOf(action, sample)
    const story = eventStory(entry)
    const text = visible(story)
    expect(story.sentence).toMatch(/^[A-Z].*\.$/s)
    expect(text.match(CAMEL)?.[0], 'a field name').toBeUndefined()
    expect(internalNameIn(text), 'a code or field name').toBeUndefined()
    expect(text.match(/.{0,20}[{[].{0,20}/)?.[0], 'JSON').toBeUndefined()
    expect(text.match(TOO_PRECISE)?.[0], 'a long decimal').toBeUndefined()
    const labels = [...story.facts.map(f => f.label), ...story.changes.map(c => c.label)]
    expect(labels.find(l => /\b(id|no)$|^Spec template/i.test(l)), 'a label from the code').toBeUndefined()
    expect(text).not.toContain(entry.hash)
    expect(text).not.toContain(action)
    const auditors = story.auditors.map(r => `${r.label} ${r.value}`).join('\n')
    expect(auditors).toContain(entry.hash)
    expect(auditors).toContain(entry.prevHash)
    expect(auditors).toContain(`Event ${entry.id}`)
  })

  it('tells a kit by its drive unit, the cars it fits and its typical car in the workshop\'s words', () => {
    const kit = eventStory(entryOf('kit.created', samples['kit.created']!))
    const row = (label: string) => kit.changes.find(c => c.label === label)?.after
    expect(row('Drive unit')).toBe(platforms[0]!.name)
    expect(row('Fits')).toBe('Tregarth Minim (1959–1969)')
    expect(row('Typical car: kerb mass (converted), kg')).toBe('640')
    expect(row('Typical car: driven axle')).toBe('Rear wheels')
    expect(visible(kit)).not.toMatch(/Spec template|Platform key|1,9\d\d/)
  })

  it('knows a code when it sees one, and a sentence when it does not', () => {
    expect(internalNameIn('Lift-off regen: fail, lift-off-regen')).toContain('lift-off-regen')
    expect(internalNameIn('The car is road-testing.')).toContain('road-testing')
    expect(internalNameIn('Event version.signed-off')).toContain('version.signed-off')
    expect(internalNameIn('Peak motor undefined °C')).toContain('undefined')
    expect(internalNameIn('powerCapKw 45')).toContain('powerCapKw')
    expect(internalNameIn('Full-power pull: pass; the full-power pull check; lift-off regen 25 %; the signed-off settings; 24 kWh')).toBeUndefined()
  })

  it('tells a sign-off with its people, version, stage and open snags', () => {
    expect(eventStory(entryOf('version.signed-off', samples['version.signed-off']!)).sentence)
      .toBe('Sol Brannagh signed Road v12 off onto the car; the car moved from road testing to snagging with 3 snags open; it replaces Road v11.')
  })

  it('rounds a road test\'s figures as the trade writes them, with units, and lists its checks', () => {
    const rt = eventStory(entryOf('road-test.recorded', samples['road-test.recorded']!))
    expect(rt.sentence).toBe('Sol Brannagh recorded a road test of Road v12: failed.')
    expect(rt.facts).toContainEqual({ label: 'Conditions', value: 'Wet, 9 °C, Forge loop, Quarry Lane (18 %)' })
    expect(rt.checks).toContainEqual({ title: 'Lift-off regen', verdict: 'Pass', measured: 'Deceleration 1.20 m/s², felt firm' })
    expect(rt.checks).toContainEqual({ title: 'Full-power pull', verdict: 'Fail', measured: 'Speed reached 104 km/h, 0–50 km/h 4.1 s' })
    const log = eventStory(entryOf('road-test.telemetry-uploaded', samples['road-test.telemetry-uploaded']!))
    expect(log.facts).toContainEqual({ label: 'Energy recovered by regen', value: '134 Wh' })
    expect(log.facts).toContainEqual({ label: 'Strongest lift-off slowing (0.5 s mean)', value: '1.20 m/s²' })
    expect(log.facts).toContainEqual({ label: 'Size', value: '2.2 MiB' })
  })

  it('shows each change as before → after, with the parent\'s value for a version drafted from it', () => {
    const drafted = eventStory(entryOf('version.created', samples['version.created']!))
    expect(drafted.sentence).toBe('Sol Brannagh drafted Road v12 from Road v11.')
    expect(drafted.changes).toContainEqual({ label: 'Power cap, kW', before: '80', after: '85.3', removed: false })
    expect(drafted.changes).toContainEqual({ label: 'Creep speed, km/h', before: '5', after: 'removed', removed: true })
    const snag = eventStory(entryOf('snag.updated', samples['snag.updated']!))
    expect(snag.changes).toEqual([
      { label: 'Status', before: 'Open', after: 'In hand', removed: false },
      { label: 'Assigned to', before: null, after: 'Ada Penhallow', removed: false }
    ])
    const diff = eventStory(entryOf('readback.differs', samples['readback.differs']!))
    expect(diff.facts.find(f => f.label === 'Differences')!.value).toBe('Power cap: 85 kW signed off, 92.3 kW found; Unknown setting: none signed off, 4 found')
  })

  it('names a car booked in from a kit by the kit and its baseline, with the record numbers for auditors', () => {
    const booked = eventStory(entryOf('vehicle.created', { entityType: 'vehicle', data: { stockRef: 'OF-107', make: 'Penhallow', model: 'Kestrel Roadster', status: 'road-testing', kitId: 1, kitName: 'Forge RD-45 small rear-drive', baselineVersionId: 9, baselineVersionNo: 1 } }))
    expect(booked.sentence).toBe('Sol Brannagh booked in Penhallow Kestrel Roadster as OF-107 from the kit Forge RD-45 small rear-drive, on its baseline v1.')
    expect(booked.facts.map(f => f.label)).toEqual(['Status'])
    expect(booked.auditors).toContainEqual({ label: 'Kit record', value: '1' })
    expect(booked.auditors).toContainEqual({ label: 'Kit baseline version record', value: '9' })
  })

  it('lists one rule\'s two warnings once, with how many of each severity', () => {
    const sent = eventStory(entryOf('version.submitted', { entityType: 'version', data: { versionNo: 1, dangerCount: 2, warnings: [{ rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'regen-grip-snow', severity: 'caution' }, { rule: 'stop-lamp', severity: 'caution' }] }, names: { version: 'Road v1' } }))
    expect(sent.facts.find(f => f.label === 'Warnings')!.value).toBe('Regen against grip, snow (2 × danger and caution); Stop lamps and regen (UN R13-H) (caution)')
    // The worst first, whatever order the checks wrote them in.
    const mixed = eventStory(entryOf('version.submitted', { entityType: 'version', data: { versionNo: 1, warnings: [{ rule: 'regen-grip-snow', severity: 'info' }, { rule: 'regen-grip-snow', severity: 'caution' }, { rule: 'regen-grip-snow', severity: 'danger' }] }, names: { version: 'Road v1' } }))
    expect(mixed.facts.find(f => f.label === 'Warnings')!.value).toBe('Regen against grip, snow (danger, caution and note)')
  })

  it('lists a drafted version\'s settings and a check\'s measurements in the drive unit\'s and the check\'s own order', () => {
    // PostgreSQL keeps a JSONB object's keys shortest first: the history must not read in that order.
    const parameters = { powerCapKw: 45, torqueCapNm: 160, motorCutoffC: 145, brakeRegenPct: 40, liftOffRegenPct: 60, motorDerateStartC: 120 }
    const drafted = eventStory(entryOf('version.created', { entityType: 'version', data: { versionNo: 1, parameters, origin: 'workshop' }, names: { version: 'Road v1' }, changes: creationRows({ parameters }) }))
    const labels = drafted.changes.map(c => c.label)
    expect(labels.indexOf('Motor derate start, °C')).toBeLessThan(labels.indexOf('Motor cut-off, °C'))
    expect(labels.indexOf('Lift-off regen, %')).toBeLessThan(labels.indexOf('Brake regen, %'))
    const soak = eventStory(entryOf('road-test.recorded', { entityType: 'road-test', data: { versionNo: 1, verdict: 'pass', checks: [{ key: 'thermal-soak', verdict: 'pass', values: { motorC: 74, batteryC: 31, inverterC: 58 } }] } }))
    expect(soak.checks[0]!.measured).toBe('Peak motor 74 °C, Peak inverter 58 °C, Peak battery 31 °C')
  })

  it('keeps a check\'s short code for the auditors, and names drive units rather than their codes', () => {
    const made = eventStory(entryOf('workshop-check.created', { entityType: 'workshop-check', data: { after: { key: 'tow-hitch', label: 'Tow hitch', record: 'pass-fail', required: true, retired: false, platformKeys: ['quennel-95', 'fenlow-45'] } } }))
    expect(made.changes.map(c => c.label)).not.toContain('Short name')
    expect(visible(made)).not.toContain('tow-hitch')
    expect(made.auditors).toContainEqual({ label: 'Short code', value: 'tow-hitch' })
    expect(made.changes.find(c => c.label === 'For drive units')!.after).toBe('Quennel 95, Fenlow 45')
    const passFail = eventStory(entryOf('workshop-check.created', { entityType: 'workshop-check', data: { after: { key: 'heater', label: 'Heater and demister', record: 'pass-fail', unit: null, min: null, max: null, required: false } } }))
    expect(passFail.changes.map(c => c.label)).toEqual(['Check', 'Recorded as', 'Required on every road test'])
  })

  it('gives a measured check its limits in its unit, and leaves out the limits a pass-or-fail check has not', () => {
    const volts = eventStory(entryOf('workshop-check.created', { entityType: 'workshop-check', data: { after: { key: 'twelve-volt', label: '12 V supply', record: 'number', unit: 'V', min: 13.2, max: 14.8, required: false, retired: false, platformKeys: null } } }))
    expect(volts.changes.map(c => [c.label, c.after])).toEqual([
      ['Check', '12 V supply'], ['Recorded as', 'A measured number'], ['Lowest allowed', '13.2 V'], ['Highest allowed', '14.8 V'], ['Unit', 'V'],
      ['Required on every road test', 'no'], ['For drive units', 'every drive unit'], ['Retired', 'no']
    ])
    const lamps = eventStory(entryOf('workshop-check.created', { entityType: 'workshop-check', data: { after: { key: 'lamps', label: 'Lamps', record: 'pass-fail', unit: null, min: null, max: null, required: true, retired: false, platformKeys: null } } }))
    expect(lamps.changes.map(c => c.label)).toEqual(['Check', 'Recorded as', 'Required on every road test', 'For drive units', 'Retired'])
  })

  it('tells a kit by its cars, years and typical car in words, and a car booked in from it by the kit\'s name', () => {
    const kit = eventStory(entryOf('kit.created', samples['kit.created']!))
    const rows = Object.fromEntries(kit.changes.map(c => [c.label, c.after]))
    expect(rows).toMatchObject({ 'Fits': 'Tregarth Minim (1959–1969)', 'Drive unit': platforms[0]!.name, 'Typical car: kerb mass (converted), kg': '640', 'Typical car: driven axle': 'Rear wheels' })
    const booked = eventStory(entryOf('vehicle.created', { entityType: 'vehicle', data: { after: { stockRef: 'OF-107', make: 'Penhallow', model: 'Kestrel Roadster', year: 1964, status: 'road-testing' }, kitId: 1, kitName: 'Forge RD-45', baselineVersionId: 9, baselineVersionNo: 1 } }))
    expect(booked.sentence).toBe('Sol Brannagh booked in 1964 Penhallow Kestrel Roadster as OF-107 from the kit Forge RD-45, on its baseline v1.')
    expect(visible(booked)).not.toMatch(/Kit name|version no/i)
    expect(booked.auditors).toContainEqual({ label: 'Kit baseline version record', value: '9' })
  })

  it('keeps the record number a snag raised from a road test carries for the auditors, out of its fields', () => {
    const raised = eventStory(entryOf('snag.created', { entityType: 'snag', data: { after: { kind: 'conversion', title: 'Regen abrupt', priority: 'high', status: 'open', blocking: false, roadTestId: 5, assigneeId: 2 } }, names: { people: { 2: 'Sol Brannagh' } } }))
    expect(raised.changes.map(c => c.label)).not.toContain('Road test id')
    expect(raised.changes.some(c => /road test/i.test(c.label))).toBe(false)
    expect(raised.changes.find(c => c.label === 'Assigned to')?.after).toBe('Sol Brannagh')
    expect(raised.auditors).toContainEqual({ label: 'Road test record', value: '5' })
  })

  it('reads each event as of its own time: what it recorded before any name looked up today', () => {
    // A snag raised open and retitled since: the raising names it as it was raised, with the stage it had then.
    const raised = entryOf('snag.created', { entityType: 'snag', data: { after: { kind: 'remedial', title: 'Wiper slow', priority: 'normal', status: 'open', blocking: true } }, names: { snag: 'Wiper motor replaced' } })
    const story = eventStory(raised)
    expect(story.sentence).toBe('Sol Brannagh raised the snag “Wiper slow”, which blocks sign-off.')
    expect(story.changes.find(c => c.label === 'Status')?.after).toBe('Open')
    // A car booked in at intake reads "intake" however far it has gone since.
    const booked = eventStory(entryOf('vehicle.created', { entityType: 'vehicle', data: { after: { stockRef: 'OF-103', make: 'Tregarth', model: 'Minim 850', year: 1965, status: 'intake' } } }))
    expect(booked.changes.find(c => c.label === 'Stage')?.after).toBe('Intake')
    // A person added under one name and renamed since is added under the name they had.
    expect(eventStory(entryOf('user.created', { entityType: 'user', data: { after: { email: 'o@forge.test', name: 'Orla Quint', roles: ['engineer'] } }, names: { person: 'Orla Brannock' } })).sentence)
      .toBe('Sol Brannagh added Orla Quint to the workshop as senior engineer.')
    expect(eventStory(entryOf('user.renamed', samples['user.renamed']!)).sentence).toBe('Sol Brannagh renamed Sol Brannagh to Sol Penrose.')
    expect(eventStory(entryOf('user.deactivated', samples['user.deactivated']!)).sentence).toBe('Sol Brannagh stood Sol Brannagh down: they can no longer sign in.')
  })

  it('names a record in each event as it was named then', () => {
    // Orla Quint from event 10, renamed Orla Brannock at event 50; a snag raised "Wiper slow" at 20, retitled at 40.
    const people: NameTimeline = new Map([[7, [{ from: 50n, name: 'Orla Brannock', before: 'Orla Quint' }]]])
    expect(nameAt(people, 7, 10n, 'Orla Brannock')).toBe('Orla Quint')
    expect(nameAt(people, 7, 50n, 'Orla Brannock')).toBe('Orla Brannock')
    expect(nameAt(people, 8, 10n, 'Ida Penrose')).toBe('Ida Penrose') // never renamed: the name today
    const snags: NameTimeline = new Map([[3, [{ from: 20n, name: 'Wiper slow' }, { from: 40n, name: 'Wiper motor replaced' }]]])
    expect([20n, 30n, 40n, 90n].map(at => nameAt(snags, 3, at, undefined))).toEqual(['Wiper slow', 'Wiper slow', 'Wiper motor replaced', 'Wiper motor replaced'])
  })

  it('counts warnings of one rule once, and calls a note a note', () => {
    const sent = eventStory(entryOf('version.submitted', { entityType: 'version', data: { versionNo: 1, warnings: [{ rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'stop-lamp', severity: 'info' }] } }))
    expect(sent.facts).toContainEqual({ label: 'Warnings', value: 'Regen against grip, snow (2 × danger); Stop lamps and regen (UN R13-H) (note)' })
  })
})
