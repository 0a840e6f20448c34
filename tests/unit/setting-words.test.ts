import { describe, expect, it } from 'vitest'
import { quennel95, peltry70 } from '../../shared/platforms/index'
import { settingLabel, settingValueWords } from '../../shared/utils/setting-words'

const q = quennel95.schema.properties as unknown as Record<string, Record<string, unknown>>
const p = peltry70.schema.properties as unknown as Record<string, Record<string, unknown>>

describe('a setting in words', () => {
  it('a number with its unit, kW with hp (NIST SP 811: 80 kW = 107.3 hp)', () => {
    expect(settingValueWords(q.powerCapKw, 80)).toBe('80 kW (107 hp)')
    expect(settingValueWords(p.powerCapHp, 75)).toBe('75 hp')
    expect(settingValueWords(p.liftOffRegen, 0.15)).toBe('0.15 (15 %)')
  })

  it('a switch as On or Off, a choice by its label', () => {
    expect(settingValueWords(q.hillHold, true)).toBe('On')
    expect(settingValueWords(q.hillHold, false)).toBe('Off')
    expect(settingValueWords(q.driveMode, 'sport')).toBe('Sport')
  })

  it('a curve as a short list of points with its axes', () => {
    expect(settingValueWords(q.throttleMap, [{ x: 0, y: 0 }, { x: 50, y: 35 }, { x: 100, y: 100 }])).toBe('0 → 0, 50 → 35, 100 → 100 (pedal % → torque %)')
    const long = Array.from({ length: 9 }, (_, i) => ({ x: i * 10, y: i * 10 }))
    expect(settingValueWords(q.throttleMap, long)).toMatch(/ and 3 more \(pedal/)
  })

  it('the label is the schema\'s title, and an absent value says so', () => {
    expect(settingLabel(q.hillHold, 'hillHold')).toBe('Hill hold')
    expect(settingValueWords(q.hillHold, undefined)).toBe('not set')
  })
})
