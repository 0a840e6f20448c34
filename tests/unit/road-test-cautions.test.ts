import { describe, it, expect } from 'vitest'
import { preDriveCautions, preDriveDeferral, preDriveRecord, preDriveText } from '../../shared/schemas/road-test-cautions'
import { roadTestCreateSchema } from '../../shared/schemas/road-test'
import { checkGuides, stepLabel } from '../../shared/schemas/road-test-checks'
import { eventStory } from '../../shared/utils/audit-story'
import { entryOf, samples } from './audit-story-fixtures'
import { internalNameIn } from './internal-names'

const everything = preDriveCautions.map(c => `${c.title}. ${c.text}`).join(' ')
const body = (extra: Record<string, unknown> = {}) => ({
  conditions: { surface: 'dry', ambientC: 12, route: '' },
  checks: checkGuides.map(g => ({ key: g.key, verdict: 'not-tested', values: {}, note: '' })),
  verdict: 'fail', ...extra
})

describe('the cautions before a road test sets off', () => {
  // What a careful workshop tells its tester before a first drive on new settings (common practice).
  it.each([
    ['a second person', /second person/i], ['a closed or quiet road where the rules allow', /closed or quiet road, where the local rules allow/i],
    ['brakes checked with regen off first', /with regen switched off.*own brakes/i], ['the way back to the previous settings', /put the previous settings back/i],
    ['tyre pressures', /tyre pressures/i], ['stop at the first doubt', /at the first .*stop where it is safe/i], ['keep off the high-voltage system', /high-voltage system/i]
  ])('says %s', (_what, words) => {
    expect(everything).toMatch(words)
  })

  it('defers to the regulations where the car is driven and to the workshop\'s qualified engineer', () => {
    expect(preDriveDeferral).toMatch(/regulations where you drive/)
    expect(preDriveDeferral).toMatch(/qualified engineer/)
  })

  it('is part of the record: a road test without the tick is refused, by its field, and one with it is taken', () => {
    const without = roadTestCreateSchema.safeParse(body())
    expect(without.success).toBe(false)
    expect(without.error!.issues.map(i => i.path.join('.'))).toContain('preDriveConfirmed')
    expect(roadTestCreateSchema.safeParse(body({ preDriveConfirmed: false })).success).toBe(false)
    expect(roadTestCreateSchema.safeParse(body({ preDriveConfirmed: true })).success).toBe(true)
  })

  it('tells the confirmation in words, and says plainly when a record has none', () => {
    expect(preDriveText(preDriveRecord(), 'Tessa Quill')).toBe(`Tessa Quill read the pre-drive cautions (${preDriveCautions.map(c => `“${c.title}”`).join(', ')}) and confirmed the car was ready to set off.`)
    expect(preDriveText(null, 'Tessa Quill')).toMatch(/^No pre-drive confirmation is on this record/)
  })

  it('shows in the history as a fact in words beside the road test', () => {
    const story = eventStory(entryOf('road-test.recorded', samples['road-test.recorded']!))
    const fact = story.facts.find(f => f.label === 'Before setting off')
    expect(fact?.value).toMatch(/^Sol Brannagh read the pre-drive cautions \(“Two people, a quiet road”, “Brakes first, regen off”,/)
    expect(internalNameIn(`${fact?.label} ${fact?.value}`)).toBeUndefined()
  })
})

describe('the road-test step bar', () => {
  it('names each drive check by a word a tester knows, short enough for a phone\'s row', () => {
    expect(checkGuides.map(stepLabel)).toEqual(['Hill start', 'Lift-off regen', 'Brake regen', 'Creep', 'Full power', 'Thermal soak'])
    for (const g of checkGuides) for (const word of stepLabel(g).split(' ')) expect(word.length, g.key).toBeLessThanOrEqual(8)
  })
})
