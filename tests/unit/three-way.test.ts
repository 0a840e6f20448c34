import { describe, it, expect } from 'vitest'
import { mergeThreeWay, settleMerge, settingsThatDiffer } from '../../shared/utils/three-way'

describe('three-way merge of a car\'s settings onto a newer kit baseline', () => {
  const base = { a: 1, b: 2, c: 3, d: 4 }
  const car = { a: 1, b: 20, c: 30, d: 4 }
  const kit = { a: 10, b: 2, c: 31, d: 4 }
  const rows = mergeThreeWay(base, car, kit)
  const row = (n: string) => rows.find(r => r.name === n)!

  it('takes the baseline\'s change where the car had not deviated', () => expect(row('a')).toMatchObject({ merged: 10, source: 'kit', conflict: false }))
  it('keeps the car\'s deviation where the baseline did not change', () => expect(row('b')).toMatchObject({ merged: 20, source: 'car', conflict: false }))
  it('shows a conflict where both changed differently', () => expect(row('c')).toMatchObject({ merged: null, conflict: true }))
  it('leaves untouched settings alone', () => expect(row('d')).toMatchObject({ merged: 4, source: 'same' }))
  it('agrees where both made the same change', () => expect(mergeThreeWay({ x: 1 }, { x: 2 }, { x: 2 })[0]).toMatchObject({ merged: 2, source: 'both', conflict: false }))

  it('settles conflicts by choice and names those left unchosen', () => {
    expect(settleMerge(rows, {})).toEqual({ parameters: { a: 10, b: 20, d: 4 }, unresolved: ['c'] })
    expect(settleMerge(rows, { c: 'kit' }).parameters).toEqual({ a: 10, b: 20, c: 31, d: 4 })
    expect(settleMerge(rows, { c: 'car' }).parameters.c).toBe(30)
  })

  it('names the settings that differ, a missing one counting as a difference', () => {
    expect(settingsThatDiffer({ a: 1, b: 2 }, { a: 1, b: 3, c: 4 })).toEqual(['b', 'c'])
  })
})
