import { describe, expect, it } from 'vitest'
import { nulFields } from '../../server/utils/guards/validate'

// PostgreSQL documents that its text types cannot store the character with code zero
// (PostgreSQL 15 manual, 8.3 "Character Types").
describe('nulFields', () => {
  it('names each value and key that holds U+0000, wherever it sits', () => {
    expect(nulFields({ q: 'a\u0000b' })).toEqual([{ path: 'q', message: expect.stringContaining('U+0000') }])
    expect(nulFields({ spec: { tyres: [{ size: 'x' }, { size: '\u0000' }] } }).map(f => f.path)).toEqual(['spec.tyres.1.size'])
    expect(nulFields({ parameters: { ['boost\u0000']: 1 } }).map(f => f.path)).toEqual(['parameters.boost'])
    expect(nulFields('\u0000').map(f => f.path)).toEqual(['(body)'])
  })

  it('passes ordinary text, and stops at twenty and at a depth no schema reaches', () => {
    expect(nulFields({ q: 'Quarry Lane, \u00e9t\u00e9 \u2713', n: 0, list: [null, true] })).toEqual([])
    expect(nulFields(Object.fromEntries(Array.from({ length: 50 }, (_, i) => [`k${i}`, '\u0000'])))).toHaveLength(20)
    let deep: unknown = '\u0000'
    for (let i = 0; i < 100_000; i++) deep = [deep]
    expect(nulFields(deep)).toEqual([])
  })
})
