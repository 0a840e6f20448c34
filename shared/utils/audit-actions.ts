import { knownChangeLabel } from './change-labels'

// Plain words for the actions the history records; an action not listed here is shown as written.
export const auditActionLabels: Record<string, string> = {
  'vehicle.created': 'Car booked in',
  'vehicle.updated': 'Car\'s facts changed',
  'vehicle.drift-cleared': 'Drift cleared',
  'kit.created': 'Kit created',
  'kit.updated': 'Kit changed',
  'fleet.rechecked': 'Re-checked with the fleet',
  'user.created': 'Person added',
  'user.updated': 'Person changed',
  'user.renamed': 'Person renamed',
  'user.roles-changed': 'Person\'s roles changed',
  'user.deactivated': 'Person deactivated',
  'user.reactivated': 'Person reactivated',
  'user.password-changed': 'Person\'s password changed',
  'profile.created': 'Profile created',
  'version.created': 'Version drafted',
  'version.updated': 'Draft edited',
  'version.edited': 'Draft edited',
  // Roadside versions recorded before they went through the one insert and submit (docs/version-lifecycle.md).
  'version.roadside-recorded': 'Recorded at the roadside',
  'version.submitted': 'Sent for review',
  'version.withdrawn': 'Withdrawn from review',
  'version.approved': 'Approved',
  'version.rejected': 'Sent back',
  'version.signed-off': 'Signed off onto the car',
  'version.superseded': 'Superseded',
  'road-test.recorded': 'Road test recorded',
  'road-test.signed': 'Road test signed',
  'road-test.telemetry': 'Controller log uploaded',
  'road-test.telemetry-uploaded': 'Controller log uploaded',
  'vehicle.status-changed': 'Stage changed',
  'workshop.settings-changed': 'Workshop settings changed',
  'snag.created': 'Snag raised',
  'snag.updated': 'Snag changed',
  'readback.matched': 'Read-back matches the car\'s profile',
  'readback.differs': 'Read-back differs: drift',
  'platform.created': 'Drive unit added'
}

export function auditActionLabel(action: string): string {
  return auditActionLabels[action] ?? action
}

// Field names as the history shows them: the workshop's words where the field has them (by the kind of
// record changed), else the path's own names ("/spec/newThing" → "spec › newThing").
export function changePathLabel(path: string, entityType?: string): string {
  return knownChangeLabel(entityType, path) ?? (path.replace(/^\//, '').split('/').map(s => s.replace(/~1/g, '/').replace(/~0/g, '~')).join(' › ') || '(whole record)')
}

export function changeValueText(value: unknown): string {
  if (value === undefined) return '—'
  if (value === null) return 'none'
  if (Array.isArray(value) && value.every(v => typeof v !== 'object')) return value.join(', ') || '(empty)'
  if (typeof value === 'object') return JSON.stringify(value)
  return String(value)
}

const detailLabels: Record<string, string> = {
  source: 'Came in as', matches: 'Matches the car\'s profile', profile: 'Profile', versionNo: 'Version', readAt: 'Read from the controller at',
  controller: 'Controller', differences: 'Differences', reason: 'Reason', verdict: 'Verdict', roadTestId: 'Road test no.', versionId: 'Version id',
  profileId: 'Profile id', passwordChanged: 'Password changed', comment: 'Comment', reviewId: 'Review no.', contentHash: 'Content hash',
  warnings: 'Warnings', dangerCount: 'Danger warnings', justifications: 'Justifications', parameters: 'Settings', rationale: 'Rationale',
  profileName: 'Profile', parentVersionId: 'Drafted from version id', parentVersionNo: 'Drafted from version', patchFromParent: 'Changed from that version',
  origin: 'Made', name: 'Name', make: 'Make', model: 'Model', status: 'Stage', stockRef: 'Stock ref', lockVersion: 'Save no.',
  supersededVersionId: 'Replaced version id', fileName: 'File', sizeBytes: 'Size (bytes)', sha256: 'SHA-256',
  kitId: 'Kit no.', kitName: 'Kit', baselineVersionId: 'Kit baseline version id', baselineVersionNo: 'Kit baseline version',
  recheckId: 'Re-check no.', result: 'Result', newWarnings: 'New warnings'
}

export function detailLabel(key: string): string {
  return detailLabels[key] ?? key
}

const isWarning = (x: unknown): x is { rule: string, severity: string } => typeof x === 'object' && x !== null && typeof (x as { rule?: unknown }).rule === 'string'
const isPatchOp = (x: unknown): x is { op: string, path: string, value?: unknown } => typeof x === 'object' && x !== null && typeof (x as { op?: unknown }).op === 'string' && typeof (x as { path?: unknown }).path === 'string'

// A detail as words: read-back differences as "parameter: signed off → found", yes/no for true/false.
export function detailText(key: string, value: unknown): string {
  if (key === 'differences' && Array.isArray(value)) {
    return value.map((d: { parameter?: string, expected?: unknown, found?: unknown }) => `${d.parameter}: ${changeValueText(d.expected ?? null)} signed off → ${changeValueText(d.found ?? null)} found`).join('; ') || 'none'
  }
  if (Array.isArray(value) && value.length && value.every(isWarning)) return value.map(w => `${w.rule} (${w.severity})`).join(', ')
  if (Array.isArray(value) && value.length && value.every(isPatchOp)) {
    return value.map(o => o.op === 'remove' ? `${changePathLabel(o.path)} removed` : `${changePathLabel(o.path)} → ${changeValueText(o.value)}`).join(', ')
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    return Object.entries(value).map(([k, v]) => `${k} ${changeValueText(v)}`).join(', ') || '—'
  }
  return changeValueText(value)
}
