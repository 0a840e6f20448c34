import { readFileSync, readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, it, expect, vi } from 'vitest'
import type { Transaction } from 'sequelize'
import { DemoStory, roadTestMoments } from '../../seeders/demo-story'
import { appendDatedAuditEvents } from '../../server/utils/history/audit'

vi.mock('../../server/utils/history/audit', () => ({ appendDatedAuditEvents: vi.fn(async () => []) }))

const walk = (dir: string): string[] => readdirSync(dir).flatMap((f) => {
  const p = join(dir, f)
  return statSync(p).isDirectory() ? walk(p) : /\.(ts|vue|mjs)$/.test(p) ? [p] : []
})

describe('the demo story', () => {
  const story = new DemoStory(new Date('2026-12-03T06:56:20.000Z'))

  it('dates things days before the run at workshop hours, and never after the run', () => {
    expect(story.day(20, '09:30').toISOString()).toBe('2026-11-13T09:30:00.000Z')
    expect(story.day(1).toISOString()).toBe('2026-12-02T09:00:00.000Z')
    expect(story.after(story.day(2, '10:30'), 25 * 60).toISOString()).toBe('2026-12-02T11:30:00.000Z')
    expect(() => story.day(0, '09:00')).toThrow(/after the seed run/)
    expect(() => story.after(story.day(1, '10:30'), 24 * 60)).toThrow(/after the seed run/)
    expect(roadTestMoments(story, story.day(19, '10:30'))).toEqual({ tested: new Date('2026-11-14T14:30:00.000Z'), signed: new Date('2026-11-14T15:30:00.000Z') })
  })

  it('appends each workshop\'s events oldest first, keeping the order of events of the same moment', async () => {
    const told = new DemoStory(new Date('2026-12-03T06:56:20.000Z'))
    const event = (workshopId: number, action: string) => ({ workshopId, action, entityType: 'vehicle', entityId: 1 })
    told.add(told.day(3), event(1, 'version.approved'))
    told.add(told.day(9), event(1, 'vehicle.created'))
    told.add(told.day(5), event(2, 'vehicle.created'))
    told.add(told.day(3), event(1, 'road-test.recorded'))
    expect(() => told.add(new Date('2026-12-04T00:00:00Z'), event(1, 'snag.created'))).toThrow(/after the seed run/)
    await told.write({} as Transaction)
    const calls = vi.mocked(appendDatedAuditEvents).mock.calls
    expect(calls.map(c => [c[1], c[2].map(e => e.action)])).toEqual([[1, ['vehicle.created', 'version.approved', 'road-test.recorded']], [2, ['vehicle.created']]])
    expect(calls[0]![2].map(e => e.at.toISOString().slice(0, 10))).toEqual(['2026-11-24', '2026-11-30', '2026-11-30'])
  })

  it('is the only writer of dated events: nothing the server, the app or the scripts run can date one', () => {
    const callers = [...walk('server'), ...walk('app'), ...walk('shared'), ...walk('scripts'), ...walk('seeders')]
      .filter(f => readFileSync(f, 'utf8').includes('appendDatedAuditEvents'))
    expect(callers.sort()).toEqual([join('seeders', 'demo-story.ts'), join('server', 'utils', 'history', 'audit.ts')])
  })
})
