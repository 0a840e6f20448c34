import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { DEFER, powerRatio, tyreLoad, tyreSpeed, type RuleInput } from '../../shared/compute/rules/index'
import { defaultSettings } from '../../shared/compute/settings'
import type { Figures } from '../../shared/compute/types'
import { ulvane220, defaultParameters, marrick110 } from '../../shared/platforms/index'

const parameters = defaultParameters(marrick110)
const figures = evaluate(exampleSpec, marrick110, parameters).figures
const input = (f: Partial<Figures>): RuleInput => ({ figures: { ...figures, ...f }, parameters, spec: exampleSpec, settings: defaultSettings })

describe('power-ratio (common practice: a conversion carries far more power than the original engine)', () => {
  it('nothing at or below 1.5 times, caution above, danger above 2.5', () => {
    expect(powerRatio(input({ powerRatioToOriginal: 1.5 }))).toEqual([])
    expect(powerRatio(input({ powerRatioToOriginal: 1.6 }))[0]).toMatchObject({ rule: 'power-ratio', severity: 'caution', limit: 1.5 })
    const [w] = powerRatio(input({ powerRatioToOriginal: 2.6 }))
    expect(w).toMatchObject({ severity: 'danger', value: 2.6, limit: 2.5 })
    expect(w!.message).toMatch(/brakes, tyres, suspension/)
    expect(w!.message.endsWith(DEFER)).toBe(true)
  })

  it('the large unit at its defaults in the small example car is a danger', () => {
    const e = evaluate(exampleSpec, ulvane220, defaultParameters(ulvane220))
    expect(e.warnings.find(w => w.rule === 'power-ratio')?.severity).toBe('danger')
  })
})

describe('tyre-speed', () => {
  it('danger when the car can go faster than its tyres are rated for, nothing at the rating', () => {
    expect(tyreSpeed(input({ topSpeedKph: 180, tyreSpeedRatingKph: 180 }))).toEqual([])
    const [w] = tyreSpeed(input({ topSpeedKph: 190, tyreSpeedRatingKph: 180 }))
    expect(w).toMatchObject({ rule: 'tyre-speed', severity: 'danger', value: 190, limit: 180 })
    expect(w!.message).toMatch(/rated for 180 km\/h/)
  })

  it('end to end: 165/80 R15 86S tyres (S, 180 km/h) and a 190 km/h speed limit on a long-geared car', () => {
    const e = evaluate({ ...exampleSpec, finalDriveRatio: 6 }, marrick110, { ...parameters, speedLimitKph: 190, powerCapKw: 110 })
    expect(e.figures.topSpeedKph!).toBeGreaterThan(180)
    expect(e.warnings.some(w => w.rule === 'tyre-speed')).toBe(true)
  })
})

describe('tyre-load (ISO 4000-1 load index table, from memory)', () => {
  it('danger over the rating, caution above 90 %, nothing below, per axle', () => {
    const capacity = { front: 530, rear: 530 }
    expect(tyreLoad(input({ tyreLoadPerTyreKg: { front: 470, rear: 400 }, tyreLoadCapacityKg: capacity }))).toEqual([])
    const ws = tyreLoad(input({ tyreLoadPerTyreKg: { front: 540, rear: 480 }, tyreLoadCapacityKg: capacity }))
    expect(ws.map(w => [w.severity, w.value, w.limit])).toEqual([['danger', 540, 530], ['caution', 480, 0.9 * 530]])
    expect(ws[0]!.message).toMatch(/each front tyre carries about 540 kg/)
  })

  it('end to end: a heavy car on 145/80 R13 75T tyres (387 kg each) is over on the front axle', () => {
    const e = evaluate({ ...exampleSpec, kerbMassKg: 1400, tyreSize: '145/80 R13 75T' }, marrick110, parameters)
    expect(e.figures.tyreLoadCapacityKg.front).toBe(387)
    expect(e.warnings.filter(w => w.rule === 'tyre-load').map(w => w.severity)).toContain('danger')
  })
})
