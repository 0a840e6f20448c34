import { knownChangeLabel } from './change-labels'
import { decodePointer } from './audit-changes'
import { unitOf, wordsOf } from './audit-values'

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
  'platform.created': 'Drive unit added',
  'workshop-check.created': 'Road-test check added',
  'workshop-check.changed': 'Road-test check changed',
  'road-test.photo-added': 'Photo added to a road test',
  'snag.photo-added': 'Photo added to a snag'
}

export function auditActionLabel(action: string): string {
  return auditActionLabels[action] ?? action.split('.').map(wordsOf).join(': ')
}

// Field names as the history shows them: the workshop's words where the field has them (by the kind of
// record changed), else the path's own names in words ("/spec/newThing" → "Spec › new thing").
export function changePathLabel(path: string, entityType?: string): string {
  const known = knownChangeLabel(entityType, path)
  if (known) return known
  const parts = decodePointer(path)
  if (!parts.length) return '(whole record)'
  const unit = unitOf(parts.at(-1)!)?.unit
  const text = `${parts.map(wordsOf).join(' › ')}${unit ? `, ${unit}` : ''}`
  return `${text[0]!.toUpperCase()}${text.slice(1)}`
}

