import { describe, it, expect } from 'vitest'
import { compareReadback } from '../../shared/utils/readback-compare'
import { readbackDocumentSchema, readbackBodySchema } from '../../shared/schemas/readback'
import { csvCell, csvLine } from '../../server/utils/history/csv'

describe('a read-back against the signed-off version', () => {
  it('matches within half a step and names every difference', () => {
    const steps = { powerCapKw: 0.5, creepTorqueNm: 0.5, liftOffRegenPct: 1 }
    expect(compareReadback({ powerCapKw: 40, liftOffRegenPct: 15 }, { powerCapKw: 40.2, liftOffRegenPct: 15 }, steps)).toEqual([])
    expect(compareReadback({ powerCapKw: 40 }, { powerCapKw: 40.25 }, steps)).toEqual([{ parameter: 'powerCapKw', expected: 40, found: 40.25 }])
    expect(compareReadback({ powerCapKw: 40, creepTorqueNm: 30 }, { powerCapKw: 40, liftOffRegenPct: 15 }, steps)).toEqual([
      { parameter: 'creepTorqueNm', expected: 30, found: null },
      { parameter: 'liftOffRegenPct', expected: null, found: 15 }
    ])
    expect(compareReadback({ x: 0.1 + 0.2 }, { x: 0.3 })).toEqual([])
    expect(compareReadback({ x: 1 }, { x: 1.001 })).toHaveLength(1)
  })

  it('reads Voltwright\'s read-back format and refuses anything else', () => {
    const doc = { format: 'voltwright-readback/1', vehicle: 'OF-101', profile: 'Road', readAt: '2026-12-01T09:30:00+01:00', parameters: { powerCapKw: 40 } }
    expect(readbackDocumentSchema.safeParse(doc).success).toBe(true)
    const bad = readbackDocumentSchema.safeParse({ ...doc, format: 'voltwright-readback/2', parameters: {}, extra: 1 })
    expect(bad.error?.issues.map(i => i.path.join('.')).sort()).toEqual(['', 'format', 'parameters'])
    expect(readbackBodySchema.safeParse({ source: 'typed', profileId: 3, parameters: { powerCapKw: 'lots' } }).success).toBe(false)
    expect(readbackBodySchema.safeParse({ source: 'scanned', document: doc }).error?.issues[0]?.path).toEqual(['source'])
  })
})

describe('CSV cells', () => {
  it('quote every cell as RFC 4180 allows (more in csv-cells.test.ts)', () => {
    // RFC 4180 section 2: any field may be quoted; a quote inside is doubled
    expect(csvCell('plain')).toBe('"plain"')
    expect(csvCell('say "hi"')).toBe('"say ""hi"""')
    expect(csvLine(['a', 'b'])).toBe('"a","b"\r\n')
  })
})
