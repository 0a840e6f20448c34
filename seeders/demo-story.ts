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

type Stage = 'intake' | 'converting' | 'road-testing' | 'snagging' | 'handed-over'
export interface BookedCar { stockRef: string, make: string, model: string, year: number, status: Stage, intakeDaysAgo: number, staged?: { daysAgo: number, time: string } }

// A demo car's booking-in as it was that morning, at intake, and its move to the stage it has now: on `staged`,
// else the next morning (work starts). The history then reads as of each event's own day, not as of the seed run.
export function bookIn(story: DemoStory, event: { workshopId: number, vehicleId: number, actorId: number }, car: BookedCar, more: Record<string, unknown> = {}) {
  const intake = story.day(car.intakeDaysAgo, '08:30')
  const base = { ...event, entityType: 'vehicle', entityId: event.vehicleId }
  story.add(intake, { ...base, action: 'vehicle.created', data: { after: { stockRef: car.stockRef, make: car.make, model: car.model, year: car.year, status: 'intake' }, ...more } })
  if (car.status === 'intake') return
  const staged = car.staged ? story.day(car.staged.daysAgo, car.staged.time) : car.intakeDaysAgo > 0 ? story.day(car.intakeDaysAgo - 1, '08:30') : story.after(intake, 60)
  story.add(staged, { ...base, action: 'vehicle.status-changed', data: { from: 'intake', to: car.status } })
}
