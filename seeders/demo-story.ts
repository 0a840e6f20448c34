import type { QueryInterface, Transaction } from 'sequelize'
import { appendDatedAuditEvents, type AuditInput } from '../server/utils/history/audit'

const MINUTE_MS = 60_000
const HOUR_MS = 60 * MINUTE_MS
const DAY_MS = 24 * HOUR_MS

// The demo's history as its story (docs/history.md#the-demo-history): every seeder adds the events of what it
// writes, each dated when the thing it records happened; the run appends them all at its end, oldest first,
// so the chain's order (by id) is the order of the dates, across cars and seeders.
export class DemoStory {
  private readonly events: { at: Date, input: AuditInput }[] = []

  constructor(readonly now = new Date()) {}

  // `days` before the run's day at a workshop hour (UTC, "HH:MM"); never later than the run itself.
  day(days: number, time = '09:00'): Date {
    const [hours, minutes] = time.split(':').map(Number) as [number, number]
    const midnight = Date.UTC(this.now.getUTCFullYear(), this.now.getUTCMonth(), this.now.getUTCDate())
    return this.notLater(new Date(midnight - days * DAY_MS + hours * HOUR_MS + minutes * MINUTE_MS))
  }

  after(at: Date, minutes: number): Date {
    return this.notLater(new Date(at.getTime() + minutes * MINUTE_MS))
  }

  add(at: Date, input: AuditInput) {
    this.events.push({ at: this.notLater(at), input })
  }

  // One append per workshop's chain, sorted by date; events of the same moment keep the order they were added in.
  async write(t: Transaction) {
    const workshops = [...new Set(this.events.map(e => e.input.workshopId))]
    for (const workshopId of workshops) {
      const events = this.events.filter(e => e.input.workshopId === workshopId).sort((a, b) => a.at.getTime() - b.at.getTime())
      await appendDatedAuditEvents(t, workshopId, events.map(e => ({ ...e.input, at: e.at })))
    }
    this.events.length = 0
  }

  private notLater(at: Date): Date {
    if (!(at.getTime() <= this.now.getTime())) throw new Error(`the demo story dates something after the seed run: ${String(at)}`)
    return at
  }
}

// A road test that afternoon, four hours after the approval, signed an hour after the drive.
export function roadTestMoments(story: DemoStory, approved: Date) {
  const tested = story.after(approved, 240)
  return { tested, signed: story.after(tested, 60) }
}

// What every demo seeder is given: the query interface, the seed run's one transaction and its story.
export interface SeedContext { qi: QueryInterface, t: Transaction, story: DemoStory }
