import { describe, it, expect } from 'vitest'
import { compareReadback } from '../../shared/utils/readback-compare'
import { fenlow45, quennel95 } from '../../shared/platforms/index'
import { readbackDocumentSchema, readbackBodySchema } from '../../shared/schemas/readback'
import { csvCell, csvLine } from '../../server/utils/history/csv'

describe('a read-back against the signed-off version', () => {
  it('matches within half a step and names every difference', () => {
    const steps = fenlow45.schema.properties as unknown as Record<string, Record<string, unknown>>
    expect(compareReadback({ powerCapKw: 40, liftOffRegenPct: 15 }, { powerCapKw: 40.2, liftOffRegenPct: 15 }, steps)).toEqual([])
    expect(compareReadback({ powerCapKw: 40 }, { powerCapKw: 40.25 }, steps)).toEqual([{ parameter: 'powerCapKw', expected: 40, found: 40.25, label: 'Power cap', expectedWords: '40 kW (54 hp)', foundWords: '40.3 kW (54 hp)' }])
    expect(compareReadback({ powerCapKw: 40, creepTorqueNm: 30 }, { powerCapKw: 40, liftOffRegenPct: 15 }, steps)).toMatchObject([
      { parameter: 'creepTorqueNm', expected: 30, found: null, label: 'Creep torque', foundWords: 'not read' },
      { parameter: 'liftOffRegenPct', expected: null, found: 15, expectedWords: 'not set', foundWords: '15 %' }
    ])
    expect(compareReadback({ x: 0.1 + 0.2 }, { x: 0.3 })).toEqual([])
    expect(compareReadback({ x: 1 }, { x: 1.001 })).toHaveLength(1)
  })

  it('compares switches, choices and curves, and says them in words', () => {
    const props = quennel95.schema.properties as unknown as Record<string, Record<string, unknown>>
    const map = [{ x: 0, y: 0 }, { x: 100, y: 100 }]
    expect(compareReadback({ hillHold: true, driveMode: 'eco', throttleMap: map }, { hillHold: true, driveMode: 'eco', throttleMap: structuredClone(map) }, props)).toEqual([])
    expect(compareReadback({ hillHold: true, driveMode: 'eco', throttleMap: map }, { hillHold: false, driveMode: 'sport', throttleMap: [{ x: 0, y: 0 }, { x: 100, y: 90 }] }, props)).toMatchObject([
      { label: 'Drive mode', expectedWords: 'Eco', foundWords: 'Sport' },
      { label: 'Hill hold', expectedWords: 'On', foundWords: 'Off' },
      { label: 'Throttle map', foundWords: '0 → 0, 100 → 90 (pedal % → torque %)' }
    ])
  })

  it('reads Voltwright\'s read-back format and refuses anything else', () => {
    const doc = { format: 'voltwright-readback/1', vehicle: 'OF-101', profile: 'Road', readAt: '2026-12-01T09:30:00+01:00', parameters: { powerCapKw: 40 } }
    expect(readbackDocumentSchema.safeParse(doc).success).toBe(true)
    const bad = readbackDocumentSchema.safeParse({ ...doc, format: 'voltwright-readback/2', parameters: {}, extra: 1 })
    expect(bad.error?.issues.map(i => i.path.join('.')).sort()).toEqual(['', 'format', 'parameters'])
    expect(readbackBodySchema.safeParse({ source: 'typed', profileId: 3, parameters: { powerCapKw: { lots: 1 } } }).success).toBe(false)
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
