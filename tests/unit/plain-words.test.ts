import { describe, it, expect } from 'vitest'
import { describeProfile, describeProfileSentence } from '../../shared/utils/plain-words'

const base = { powerCapKw: 85, speedLimitKph: 120, regenTorqueLimitNm: 80, liftOffRegenPct: 10, brakeRegenPct: 40, creepTorqueNm: 0, creepSpeedKph: 5 }

describe('a profile in the owner\'s words', () => {
  it('says the power cap in kW with hp beside it', () => {
    // 85 kW / 745.69987158 W per hp = 113.99 hp (NIST SP 811, App. B.8)
    expect(describeProfile(base, { liftOffDecelMs2: 0.5 })).toEqual([
      'power limited to 85 kW (114 hp)', 'top speed limited to 120 km/h (75 mph)', 'gentle lift-off regen', 'regen on the brake pedal', 'creep off'
    ])
    // 120 km/h / 1.609344 km per mile = 74.6 mph (NIST SP 811)
    expect(describeProfileSentence({ powerCapKw: 85, liftOffRegenPct: 10, regenTorqueLimitNm: 80, creepTorqueNm: 0 }, { liftOffDecelMs2: 0.5 }))
      .toBe('Power limited to 85 kW (114 hp), gentle lift-off regen, creep off.')
  })

  it('grades lift-off regen by the car\'s deceleration at the stop-lamp thresholds of UN R13-H', () => {
    // UN Regulation No. 13-H para 5.2.22.4: no stop lamps at or below 0.7 m/s², stop lamps above 1.3 m/s²
    const words = (d: number) => describeProfile(base, { liftOffDecelMs2: d })[2]
    expect(words(0.7)).toBe('gentle lift-off regen')
    expect(words(0.71)).toBe('moderate lift-off regen')
    expect(words(1.3)).toBe('moderate lift-off regen')
    expect(words(1.31)).toBe('strong lift-off regen (the brake lights come on)')
    expect(describeProfile({ ...base, liftOffRegenPct: 0 })[2]).toBe('no lift-off regen')
    expect(describeProfile({ ...base, liftOffRegenPct: 70 })[2]).toBe('strong lift-off regen')
  })

  it('says how the car creeps, and leaves out what the profile does not set', () => {
    expect(describeProfile({ creepTorqueNm: 30, creepSpeedKph: 4.5 })).toEqual(['creeps like an automatic, up to 4.5 km/h'])
    expect(describeProfile({ brakeRegenPct: 0 })).toEqual(['no regen on the brake pedal'])
    expect(describeProfile({})).toEqual([])
    expect(describeProfileSentence({})).toBe('')
  })
})

describe('any drive unit in the owner\'s words', () => {
  it('reads the roles in their own units, then switches and modes by their titles', async () => {
    const { describeSettings } = await import('../../shared/utils/plain-words')
    const { defaultParameters, peltry70, quennel95 } = await import('../../shared/platforms/index')
    // 75 hp × 745.699872 W = 55.9 kW (NIST SP 811); 80 mph × 1.609344 = 128.7 km/h
    expect(describeSettings(peltry70.schema, defaultParameters(peltry70)).slice(0, 2)).toEqual(['power limited to 56 kW (75 hp)', 'top speed limited to 129 km/h (80 mph)'])
    const q = describeSettings(quennel95.schema, { ...defaultParameters(quennel95), driveMode: 'sport' })
    expect(q).toEqual(expect.arrayContaining(['hill hold on', 'drive mode: sport']))
    expect(q.some(w => w.includes('creep'))).toBe(false)
  })
})
