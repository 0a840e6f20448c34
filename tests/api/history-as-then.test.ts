import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn } from './helpers'
import { addPerson } from './fixtures'
import { newCar } from './road-test-fixtures'
import { eventStory } from '../../shared/utils/audit-story'
import type { HistoryEntry } from '../../shared/schemas/history'
import { demoCars } from '../../seeders/demo-cars'

// Each event reads as of its own time: what it recorded, and names as they were then (docs/history.md).
describe('the history as it was at each event', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const auditor = await signIn('auditor@voltwright.test')
  const history = async (carId: number): Promise<HistoryEntry[]> => (await auditor.call('GET', `/api/vehicles/${carId}/history?limit=100`)).body.items
  const one = (items: HistoryEntry[], action: string) => items.find(e => e.action === action)!
  const row = (e: HistoryEntry, label: string) => eventStory(e).changes.find(c => c.label === label)

  it('keeps a car booked in at intake and a snag raised open, after the car moves on, the snag is retitled and cleared and its assignee renamed', async () => {
    const car = await newCar(tuner)
    const fitter = await addPerson(['tester'], 'Orla Quint')
    const raised = await tester.call('POST', `/api/vehicles/${car.id}/snags`, { kind: 'remedial', title: 'Wiper slow', blocking: true, assigneeId: fitter.id })
    expect(raised.status).toBe(201)
    expect((await tuner.call('PATCH', `/api/vehicles/${car.id}`, { status: 'converting' })).status).toBe(200)
    expect((await tuner.call('PATCH', `/api/snags/${raised.body.id}`, { priority: 'high' })).status).toBe(200)
    expect((await tuner.call('PATCH', `/api/snags/${raised.body.id}`, { title: 'Wiper motor replaced', status: 'done' })).status).toBe(200)
    expect((await admin.call('PATCH', `/api/users/${fitter.id}`, { name: 'Orla Brannock' })).status).toBe(200)

    const items = await history(car.id)
    const booked = one(items, 'vehicle.created')
    expect(row(booked, 'Stage')?.after).toBe('Intake')
    expect(eventStory(booked).sentence).toContain(`as ${car.stockRef}`)
    const moved = row(one(items, 'vehicle.updated'), 'Stage')
    expect([moved?.before, moved?.after]).toEqual(['Intake', 'Converting'])

    const snag = one(items, 'snag.created')
    expect(eventStory(snag).sentence).toBe('Sol Brannagh raised the snag “Wiper slow”, which blocks sign-off.')
    expect(row(snag, 'Status')?.after).toBe('Open')
    expect(row(snag, 'Assigned to')?.after).toBe('Orla Quint')
    expect(JSON.stringify(eventStory(snag))).not.toContain('Brannock')
    const [cleared, raisedPriority] = items.filter(e => e.action === 'snag.updated') // newest first
    expect(eventStory(raisedPriority!).sentence).toMatch(/changed the snag “Wiper slow”\.$/)
    expect(eventStory(cleared!).sentence).toMatch(/changed the snag “Wiper motor replaced”\.$/)
    expect(row(cleared!, 'Status')).toMatchObject({ before: 'Open', after: 'Done' })
    expect(row(cleared!, 'Snag')).toMatchObject({ before: 'Wiper slow', after: 'Wiper motor replaced' })
    // The snag's page today has its new title and the assignee's new name.
    expect((await tester.call('GET', `/api/snags/${raised.body.id}`)).body).toMatchObject({ title: 'Wiper motor replaced', status: 'done', assignee: { name: 'Orla Brannock' } })
    expect((await admin.call('PATCH', `/api/users/${fitter.id}`, { active: false })).status).toBe(200)
  })

  it('books every demo car in at intake, and its later stage is an event of its own', async () => {
    const cars: { id: number, stockRef: string, status: string }[] = (await auditor.call('GET', '/api/vehicles?limit=100')).body.items
    const moved = demoCars.filter(c => c.status !== 'intake')
    expect(moved.length).toBeGreaterThan(3)
    for (const demo of moved) {
      const car = cars.find(c => c.stockRef === demo.stockRef)!
      const items = await history(car.id)
      expect(row(one(items, 'vehicle.created'), 'Stage')?.after, demo.stockRef).toBe('Intake')
      const stages = items.filter(e => e.action === 'vehicle.status-changed')
      expect(stages.map(e => e.details.to), demo.stockRef).toContain(car.status)
      // A snag raised on a demo car was raised open, whatever it is now.
      for (const s of items.filter(e => e.action === 'snag.created')) {
        const status = row(s, 'Status')
        if (status) expect(status.after, `${demo.stockRef}: ${eventStory(s).sentence}`).toBe('Open')
      }
    }
  })
})
