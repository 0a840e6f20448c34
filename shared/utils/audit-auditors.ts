// What an auditor checks an event by, kept out of the main text: its number, its code, the record numbers it
// names and the hashes that chain it (docs/history.md).
import type { HistoryEntry } from '../schemas/history'
import { formatDateTime } from './dates'
import { keyLabel } from './audit-values'

const AUDITOR_KEY = /(Id|Hash)$|^(sha256|hash|lockVersion|because)$/
export const isAuditorKey = (key: string) => AUDITOR_KEY.test(key)
// A record number a change carries in its own fields ("/roadTestId" of a snag raised from a road test): the
// auditors' to read. People's ids are not among them: the history names the person.
export const recordNumberPath = (path: string) => /^\/[A-Za-z]+$/.test(path) && isAuditorKey(path.slice(1)) && !['/assigneeId', '/ownerUserId'].includes(path)
export const auditorLabel = (key: string) => idLabels[key] ?? keyLabel(key)

const idLabels: Record<string, string> = {
  versionId: 'Version record', profileId: 'Profile record', roadTestId: 'Road test record', reviewId: 'Review record',
  parentVersionId: 'Drafted from version record', supersededVersionId: 'Replaced version record', attachmentId: 'File record',
  telemetryLogId: 'Controller log record', contentHash: 'Settings hash at this step', versionContentHash: 'Version\'s settings hash',
  kitId: 'Kit record', baselineVersionId: 'Kit baseline version record',
  sha256: 'File SHA-256', lockVersion: 'Save number', because: 'Because of'
}

export function auditorRows(e: HistoryEntry): { label: string, value: string }[] {
  const rows = [
    { label: 'Event', value: e.id },
    { label: 'Recorded at (UTC)', value: `${e.createdAt} (${formatDateTime(e.createdAt)})` },
    { label: 'Action code', value: e.action },
    { label: 'Record', value: `${e.entityType} ${e.entityId}` }
  ]
  const signed = e.details.signed
  for (const [k, v] of Object.entries({ ...e.details, ...(signed && typeof signed === 'object' ? { signedContentHash: (signed as Record<string, unknown>).contentHash } : {}) })) {
    if (!isAuditorKey(k) || v === null || v === undefined || typeof v === 'object') continue
    rows.push({ label: auditorLabel(k), value: String(v) })
  }
  rows.push({ label: 'Previous hash', value: e.prevHash ?? 'none (first event)' }, { label: 'Hash', value: e.hash })
  return rows
}
