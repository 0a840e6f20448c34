// One event per action the product writes, with the data its writer records (server/utils/**, seeders/**).
import type { ChangeRow, EventNames, HistoryEntry } from '../../shared/schemas/history'
import { changeRows, creationRows, eventDetails } from '../../shared/utils/audit-changes'
import { preDriveRecord } from '../../shared/schemas/road-test-cautions'
import { platforms } from '../../shared/platforms'

const HASH = 'a'.repeat(64)
const PREV = 'b'.repeat(64)
const parameters = { powerCapKw: 85.33333333333333, liftOffRegenPct: 12.5, creepTorqueNm: 0, speedLimitKph: 120 }
const summary = { samples: 12000, durationS: 1843.2, peakSpeedKph: 104.55555555555556, peakPowerKw: 61.23456789, peakLiftOffDecelMs2: 1.2, energyOutWh: 1734.6666666666667,
  energyRegenWh: 134.4, peakMotorC: 71.25, peakInverterC: 55.5, peakBatteryC: 29.1, maxRollbackM: 0.04444444444 }
const checks = [
  { key: 'hill-start', verdict: 'pass', values: { gradientPct: 14, rollbackMm: 40 } },
  { key: 'lift-off-regen', verdict: 'pass', values: { decelMs2: 1.2, feel: 'firm' } },
  { key: 'brake-regen', verdict: 'not-tested', values: {} },
  { key: 'creep', verdict: 'pass', values: { speedKph: 4, holdsOnGradientPct: 3.5 } },
  { key: 'full-power', verdict: 'fail', values: { peakSpeedKph: 104, zeroTo50S: 4.1 } },
  { key: 'thermal-soak', verdict: 'pass', values: { motorC: 71, inverterC: 55, batteryC: 29 } }
]

interface Sample { entityType: string, entityId?: string, data: Record<string, unknown>, names?: Partial<EventNames>, changes?: ChangeRow[] }

export const samples: Record<string, Sample> = {
  'vehicle.created': { entityType: 'vehicle', data: { after: { stockRef: 'OF-101', make: 'Tregarth', model: 'Minim 850', year: 1968, ownerUserId: 7, platformKey: 'fenlow-45', spec: { kerbMassKg: 690.5, wheelbaseM: 2.036 } } }, names: { people: { 7: 'Ada Penhallow' } } },
  'vehicle.updated': { entityType: 'vehicle', data: { patch: [{ op: 'replace', path: '/spec/kerbMassKg', value: 1075.123456 }, { op: 'add', path: '/spec/newThing', value: 3 }], before: { spec: { kerbMassKg: 1050 } } } },
  'vehicle.drift-cleared': { entityType: 'vehicle', data: { reason: 'Workshop version 12 of Road signed off after its road test', versionId: 41, patch: [{ op: 'replace', path: '/driftedAt', value: null }], before: { driftedAt: '2026-12-01T10:15:00.000Z' } }, names: { version: 'Road v12' } },
  'vehicle.status-changed': { entityType: 'vehicle', data: { from: 'converting', to: 'road-testing', because: 'road test 17' } },
  'user.created': { entityType: 'user', data: { after: { email: 'sol@forge.test', name: 'Sol Brannagh', roles: ['tester', 'tuner'] } }, names: { person: 'Sol Brannagh' } },
  'user.renamed': { entityType: 'user', data: { patch: [{ op: 'replace', path: '/name', value: 'Sol Penrose' }], before: { name: 'Sol Brannagh' }, name: 'Sol Penrose' }, names: { person: 'Sol Penrose' } },
  'user.roles-changed': { entityType: 'user', data: { patch: [{ op: 'replace', path: '/roles', value: ['tester'] }], before: { roles: ['tester', 'tuner'] }, name: 'Sol Brannagh' }, names: { person: 'Sol Brannagh' } },
  'user.deactivated': { entityType: 'user', data: { patch: [{ op: 'replace', path: '/active', value: false }], before: { active: true }, name: 'Sol Brannagh' }, names: { person: 'Sol Brannagh' } },
  'user.reactivated': { entityType: 'user', data: { patch: [{ op: 'replace', path: '/active', value: true }], before: { active: false }, name: 'Sol Brannagh' }, names: { person: 'Sol Brannagh' } },
  'user.password-changed': { entityType: 'user', data: { name: 'Sol Brannagh' }, names: { person: 'Sol Brannagh' } },
  'user.updated': { entityType: 'user', data: { patch: [{ op: 'replace', path: '/roles', value: ['tester'] }, { op: 'replace', path: '/active', value: false }], passwordChanged: true, before: { roles: ['tester', 'tuner'], active: true } }, names: { person: 'Sol Brannagh' } },
  'profile.created': { entityType: 'profile', data: { name: 'Road' } },
  'version.created': { entityType: 'version', data: { profileId: 3, profileName: 'Road', versionNo: 12, parentVersionId: 40, parentVersionNo: 11, origin: 'workshop', contentHash: HASH, parameters, rationale: 'x'.repeat(4000), patchFromParent: [{ op: 'replace', path: '/powerCapKw', value: 85.33333333333333 }, { op: 'remove', path: '/creepSpeedKph' }] }, names: { version: 'Road v12', parentVersion: 'Road v11' } },
  'version.edited': { entityType: 'version', data: { versionNo: 12, patch: [{ op: 'replace', path: '/parameters/liftOffRegenPct', value: 12.5 }, { op: 'replace', path: '/rationale', value: 'Softer lift-off for the owner' }], lockVersion: 3, contentHash: HASH }, names: { version: 'Road v12' } },
  'version.roadside-recorded': { entityType: 'version', data: { roadTestId: 17, profileId: 3, versionNo: 13, parentVersionId: 41, contentHash: HASH, warnings: [{ rule: 'stop-lamp', severity: 'caution' }] }, names: { version: 'Road v13', parentVersion: 'Road v12' } },
  'version.submitted': { entityType: 'version', data: { versionNo: 12, contentHash: HASH, dangerCount: 1, warnings: [{ rule: 'regen-grip-snow', severity: 'danger' }, { rule: 'stop-lamp', severity: 'caution' }], justifications: { 'regen-grip-snow': 'The car is laid up from November to March.' } }, names: { version: 'Road v12' } },
  'version.withdrawn': { entityType: 'version', data: { versionNo: 12, fromState: 'in-review' }, names: { version: 'Road v12' } },
  'version.approved': { entityType: 'version', data: { versionNo: 12, reviewId: 9, comment: 'Good; watch the inverter on the pull.', contentHash: HASH }, names: { version: 'Road v12' } },
  'version.rejected': { entityType: 'version', data: { versionNo: 12, reviewId: 10, comment: 'Too much lift-off regen for a wet winter.', contentHash: HASH }, names: { version: 'Road v12' } },
  'version.signed-off': { entityType: 'version', data: { roadTestId: 17, versionNo: 12, profileId: 3, profileName: 'Road', contentHash: HASH, versionContentHash: HASH, supersededVersionId: 39, vehicleStatus: { from: 'road-testing', to: 'snagging' }, unresolvedSnags: 3 }, names: { version: 'Road v12', supersededVersion: 'Road v11' } },
  'road-test.recorded': { entityType: 'road-test', data: { versionId: 41, versionNo: 12, verdict: 'fail', conditions: { surface: 'wet', ambientC: 9, route: 'Forge loop, Quarry Lane (18 %)' }, checks, preDrive: preDriveRecord() }, names: { version: 'Road v12' } },
  'road-test.telemetry-uploaded': { entityType: 'road-test', data: { telemetryLogId: 5, attachmentId: 22, filename: 'forge-loop.csv', bytes: 2_345_678, sha256: HASH, summary }, names: { version: 'Road v12' } },
  'road-test.photo-added': { entityType: 'road-test', data: { attachmentId: 23, filename: 'hill.jpg', bytes: 345_678, sha256: HASH, caption: 'Quarry Lane', width: 4032, height: 3024 }, names: { version: 'Road v12' } },
  'snag.photo-added': { entityType: 'snag', data: { attachmentId: 24, filename: 'relay.jpg', bytes: 145_678, sha256: HASH, caption: '', width: 1600, height: 1200 }, names: { snag: 'Coolant pump relay chatters at idle' } },
  'snag.created': { entityType: 'snag', data: { after: { kind: 'conversion', title: 'Coolant pump relay chatters at idle', detail: 'Audible at rest.', priority: 'normal', blocking: true, assigneeId: 7 } }, names: { people: { 7: 'Ada Penhallow' } } },
  'snag.updated': { entityType: 'snag', data: { patch: [{ op: 'test', path: '/status', value: 'open' }, { op: 'replace', path: '/status', value: 'in-hand' }, { op: 'replace', path: '/assigneeId', value: 7 }] }, names: { snag: 'Coolant pump relay chatters at idle', people: { 7: 'Ada Penhallow' } } },
  'readback.matched': { entityType: 'readback', data: { profileId: 3, profile: 'Road', versionId: 41, versionNo: 12, source: 'file', readAt: '2026-12-02T08:30:00.000Z', controller: { serial: 'FX-2231', firmware: '4.2.1' }, matches: true, differences: [], patch: [], before: { driftedAt: null } }, names: { version: 'Road v12' } },
  'readback.differs': { entityType: 'readback', data: { profileId: 3, profile: 'Road', versionId: 41, versionNo: 12, source: 'typed', readAt: null, controller: null, matches: false, differences: [{ parameter: 'powerCapKw', expected: 85, found: 92.33333333 }, { parameter: 'unknownSetting', expected: null, found: 4 }], patch: [{ op: 'replace', path: '/driftedAt', value: '2026-12-02T09:00:00.000Z' }], before: { driftedAt: null } }, names: { version: 'Road v12' } },
  'workshop.settings-changed': { entityType: 'workshop', data: { patch: [{ op: 'replace', path: '/friction/snow', value: 0.15 }, { op: 'replace', path: '/units/speed', value: 'mph' }], before: { friction: { snow: 0.2 }, units: { speed: 'km/h' } } } },
  'workshop-check.created': { entityType: 'workshop-check', data: { after: { key: 'heater-demister', label: 'Heater and demister', record: 'pass-fail', required: false, retired: false } } },
  'workshop-check.changed': { entityType: 'workshop-check', data: { before: { label: 'Heater and demister', required: false }, after: { label: 'Heater and demister', required: true } } },
  'kit.created': { entityType: 'kit', data: { after: { name: 'Tregarth Minim rear-drive kit', platformKey: platforms[0]!.key, fits: [{ make: 'Tregarth', model: 'Minim', yearFrom: 1959, yearTo: 1969 }], specTemplate: { kerbMassKg: 640, drivenAxle: 'rear' } } } },
  'kit.updated': { entityType: 'kit', data: { patch: [{ op: 'replace', path: '/name', value: 'Tregarth Minim kit, mark 2' }] } },
  'fleet.rechecked': { entityType: 'version', data: { recheckId: 4, reason: 'thresholds', versionNo: 12, result: 'new warnings', newWarnings: [{ rule: 'regen-grip-snow', severity: 'danger' }] }, names: { version: 'Road v12' } },
  'platform.created': { entityType: 'platform', data: { after: { key: platforms[0]!.key, name: platforms[0]!.name, motorMaxRpm: 9000, schema: platforms[0]!.schema } } }
}

// Legacy and bench-only actions the history still reads.
export const legacySamples: Record<string, Sample> = {
  'version.updated': { entityType: 'version', data: { patch: [{ op: 'replace', path: '/parameters/powerCapKw', value: 42 }] } },
  'version.superseded': { entityType: 'version', data: { versionNo: 11 }, names: { version: 'Road v11' } },
  'road-test.signed': { entityType: 'road-test', data: { versionId: 41 } },
  'road-test.telemetry': { entityType: 'road-test', data: { filename: 'old.csv', bytes: 900 } }
}

export function entryOf(action: string, s: Sample, id = 1001): HistoryEntry {
  return {
    id: String(id), createdAt: '2026-12-02T14:05:00.000Z', action, entityType: s.entityType, entityId: s.entityId ?? '41',
    vehicle: { id: 4, stockRef: 'OF-104' }, actor: { id: 2, name: 'Sol Brannagh' },
    changes: s.changes ?? (action === 'version.created' ? creationRows(s.data, { powerCapKw: 80, creepSpeedKph: 5 }) : changeRows(s.data)),
    details: eventDetails(s.data), names: { people: {}, ...s.names }, hash: HASH, prevHash: PREV
  }
}
