import { describe, expect, it } from 'vitest'
import { TYRE_DESIGNATION } from '../../shared/schemas/vehicle-spec'
import { LOAD_INDEX_MAX, loadCapacityKg, SPEED_SYMBOL_KPH, speedRatingKph } from '../../shared/compute/tyre-tables'
import { overallDiameterMm, parseTyreSize, rollingRadiusM, type TyreSize } from '../../shared/compute/tyres'

function parsed(text: string): TyreSize {
  const r = parseTyreSize(text)
  if (!r.ok) throw new Error(r.message)
  return r.tyre
}

function failure(text: unknown): string {
  const r = parseTyreSize(text)
  if (r.ok) throw new Error(`expected "${String(text)}" to be refused`)
  return r.message
}

describe('reading a tyre designation', () => {
  it('reads "165/80 R15 86S" into its parts', () => {
    expect(parsed('165/80 R15 86S')).toMatchObject({ widthMm: 165, aspectPct: 80, rimIn: 15, loadIndex: 86, speedSymbol: 'S' })
  })

  it('reads "205/60R16 92V" without the space, and lower case, and ZR', () => {
    expect(parsed('205/60R16 92V')).toMatchObject({ widthMm: 205, aspectPct: 60, rimIn: 16, loadIndex: 92, speedSymbol: 'V' })
    expect(parsed('  145/80 r13 75t ')).toMatchObject({ rimIn: 13, loadIndex: 75, speedSymbol: 'T' })
    expect(parsed('225/45 ZR17 94W').speedSymbol).toBe('W')
  })

  it('accepts what the vehicle spec schema accepts', () => {
    for (const t of ['165/80 R15 86S', '205/60R16 92V', '185/70 R14 88H', '225/45 ZR17 94W']) {
      expect(TYRE_DESIGNATION.test(t)).toBe(true)
      expect(parseTyreSize(t).ok).toBe(true)
    }
  })

  it('says what is missing from a size without a service description', () => {
    expect(failure('165/80 R15')).toMatch(/no service description.*load index and speed symbol/)
  })

  it('explains an old-style size such as 165SR15', () => {
    expect(failure('165SR15')).toMatch(/old-style size/)
    expect(failure('165 R15')).toMatch(/old-style size/)
  })

  it('refuses cross-ply sizes, unknown speed symbols, empty input and non-text', () => {
    expect(failure('165/80-15 86S')).toMatch(/not a radial/)
    expect(failure('165/80 R15 86X')).toMatch(/speed symbol "X" is not in the standard table/)
    expect(failure('')).toMatch(/No tyre size given/)
    expect(failure(undefined)).toMatch(/No tyre size given/)
    expect(failure('big ones')).toMatch(/not a tyre size Voltwright can read/)
  })
})

describe('tyre geometry (ISO 4000-1 / ETRTO design overall diameter, clause from memory)', () => {
  it.each([
    ['165/80 R15 86S', 645],
    ['205/60 R16 92V', 652.4],
    ['145/80 R13 75T', 562.2]
  ])('%s has an overall diameter of %d mm', (size, mm) => {
    expect(overallDiameterMm(parsed(size))).toBeCloseTo(mm, 6)
  })

  it('rolling circumference is about 3.05·D for a radial tyre (ETRTO rule of thumb, from memory)', () => {
    const d = overallDiameterMm(parsed('165/80 R15 86S'))
    expect(2 * Math.PI * rollingRadiusM(d)).toBeCloseTo((3.05 * d) / 1000, 9)
    // And so a little under the free radius, as a loaded tyre is.
    expect(rollingRadiusM(d)).toBeLessThan(d / 2000)
    expect(rollingRadiusM(d)).toBeGreaterThan(0.95 * (d / 2000))
  })
})

describe('load index table (ISO 4000-1 / ETRTO, from memory)', () => {
  it.each([[78, 425], [80, 450], [82, 475], [84, 500], [86, 530], [88, 560], [91, 615]])('index %d carries %d kg', (li, kg) => {
    expect(loadCapacityKg(li)).toBe(kg)
  })

  it('covers at least indices 60 to 110 and rises with every index', () => {
    expect(LOAD_INDEX_MAX).toBeGreaterThanOrEqual(110)
    for (let li = 1; li <= LOAD_INDEX_MAX; li++) expect(loadCapacityKg(li)!).toBeGreaterThan(loadCapacityKg(li - 1)!)
  })

  it('follows the table\'s geometric progression, ten times the load every 80 indices from 45 kg, to within 3 %', () => {
    // A typo in any entry would break this: the standard table rounds 45·10^(LI/80).
    for (let li = 0; li <= LOAD_INDEX_MAX; li++) {
      const ideal = 45 * 10 ** (li / 80)
      expect(Math.abs(loadCapacityKg(li)! - ideal) / ideal).toBeLessThan(0.03)
    }
  })

  it('has no entry outside the table', () => {
    expect(loadCapacityKg(-1)).toBeNull()
    expect(loadCapacityKg(LOAD_INDEX_MAX + 1)).toBeNull()
    expect(loadCapacityKg(86.5)).toBeNull()
  })
})

describe('speed symbol table (ISO 4000-1 / ETRTO, from memory)', () => {
  it.each(Object.entries({ L: 120, M: 130, N: 140, P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200, H: 210, V: 240, W: 270, Y: 300 }))(
    'symbol %s is %d km/h', (symbol, kph) => {
      expect(speedRatingKph(symbol)).toBe(kph)
    })

  it('rises in the order J K L … U H V W Y, with H after U', () => {
    const order = 'BCDEFGJKLMNPQRSTUHVWY'.split('')
    expect(Object.keys(SPEED_SYMBOL_KPH).sort((a, b) => SPEED_SYMBOL_KPH[a]! - SPEED_SYMBOL_KPH[b]!)).toEqual(order)
    expect(speedRatingKph('z')).toBeNull()
  })
})
