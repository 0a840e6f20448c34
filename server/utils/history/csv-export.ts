import { Readable } from 'node:stream'
import type { H3Event } from 'h3'
import type { HistoryEntry, HistoryQuery } from '../../../shared/schemas/history'
import { eventStory } from '../../../shared/utils/audit-story'
import { formatDateTime } from '../../../shared/utils/dates'
import { walkHistory, type HistoryScope } from './read'
import { csvLine } from './csv'

const COLUMNS = ['event', 'time (UTC)', 'when (UTC)', 'car', 'action', 'what happened', 'entity', 'by', 'changes (before → after)', 'details', 'previous hash', 'hash']

// The same words as the screen (shared/utils/audit-story.ts), with the codes and hashes in columns of their own.
export function entryCells(e: HistoryEntry): string[] {
  const story = eventStory(e)
  // A record's creation has no "before": it reads as what it was recorded with, as on the screen.
  const changes = story.changes.map(c => story.created ? `${c.label}: ${c.after}` : `${c.label}: ${c.before ?? '(not recorded)'} → ${c.after}`).join('; ')
  const details = [...story.facts.map(f => `${f.label}: ${f.value}`), ...story.checks.map(c => `${c.title}: ${c.verdict.toLowerCase()}${c.measured ? `, ${c.measured}` : ''}`)].join('; ')
  return [e.id, e.createdAt, formatDateTime(e.createdAt, { timeZone: 'UTC' }), e.vehicle?.stockRef ?? '', e.action, story.sentence, `${e.entityType} ${e.entityId}`,
    e.actor?.name ?? 'Voltwright', changes, details, e.prevHash ?? '', e.hash]
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
