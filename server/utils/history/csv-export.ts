import { Readable } from 'node:stream'
import type { H3Event } from 'h3'
import type { HistoryEntry, HistoryQuery } from '../../../shared/schemas/history'
import { auditActionLabel, changePathLabel, changeValueText } from '../../../shared/utils/audit-actions'
import { walkHistory, type HistoryScope } from './read'
import { csvLine } from './csv'

const COLUMNS = ['event', 'time (UTC)', 'car', 'action', 'what happened', 'entity', 'by', 'changes (before → after)', 'details', 'previous hash', 'hash']

export function entryCells(e: HistoryEntry): string[] {
  const changes = e.changes.map(c => `${changePathLabel(c.path, e.entityType)}: ${c.beforeKnown ? changeValueText(c.before) : '(not recorded)'} → ${changeValueText(c.after)}`).join('; ')
  return [e.id, e.createdAt, e.vehicle?.stockRef ?? '', e.action, auditActionLabel(e.action), `${e.entityType} ${e.entityId}`,
    e.actor?.name ?? 'Voltwright', changes, Object.keys(e.details).length ? JSON.stringify(e.details) : '', e.prevHash ?? '', e.hash]
}

// Streams the filtered history as CSV, a thousand events at a time, so a long history never sits in memory.
export function sendHistoryCsv(event: H3Event, scope: HistoryScope, q: Omit<HistoryQuery, 'limit'>, filename: string) {
  setResponseHeaders(event, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': `attachment; filename="${filename.replace(/[^\w.-]/g, '_')}"`,
    'cache-control': 'no-store'
  })
  async function* lines() {
    yield `\uFEFF${csvLine(COLUMNS)}`
    for await (const batch of walkHistory(scope, q)) yield batch.map(e => csvLine(entryCells(e))).join('')
  }
  return sendStream(event, Readable.from(lines()))
}
