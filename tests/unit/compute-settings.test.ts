import { describe, expect, it } from 'vitest'
import { exampleSpec } from '../../shared/compute/example'
import { PARAMETER_NAMES } from '../../shared/compute/parameters'
import { defaultSettings, workshopSettingsSchema } from '../../shared/compute/settings'

describe('workshop settings defaults', () => {
  it('dry friction sits within handbook ranges: Bosch peak 0.85, Noon sliding 0.65 on dry asphalt', () => {
    expect(defaultSettings.friction.dry).toBeGreaterThanOrEqual(0.65)
    expect(defaultSettings.friction.dry).toBeLessThanOrEqual(0.85)
  })

  it('wet friction sits within handbook ranges: Noon sliding 0.50, Bosch peak 0.65 on wet roads', () => {
    expect(defaultSettings.friction.wet).toBeGreaterThanOrEqual(0.5)
    expect(defaultSettings.friction.wet).toBeLessThanOrEqual(0.65)
  })

  it('snow friction sits within Noon\'s 0.20-0.25 and above ice (Bosch ≤ 0.1)', () => {
    expect(defaultSettings.friction.snow).toBeGreaterThanOrEqual(0.2)
    expect(defaultSettings.friction.snow).toBeLessThanOrEqual(0.25)
    expect(defaultSettings.friction.snow).toBeGreaterThan(0.1)
  })

  it('minimum start gradient is the 20 % of the UN R13-H parking-brake test (from memory)', () => {
    expect(defaultSettings.minStartGradePct).toBe(20)
  })

  it('has the thresholds the rules need, in a sensible order', () => {
    expect(defaultSettings.powerRatio.caution).toBeLessThan(defaultSettings.powerRatio.danger)
    expect(defaultSettings.minCreepHoldGradePct).toBeGreaterThan(0)
    expect(defaultSettings.minDerateBandC).toBeGreaterThan(0)
    expect(defaultSettings.units).toEqual({ power: 'kW+hp', speed: 'km/h' })
  })

  it('fills a partial stored setting from the defaults', () => {
    const s = workshopSettingsSchema.parse({ friction: { wet: 0.55 }, units: { speed: 'mph' } })
    expect(s.friction).toEqual({ dry: 0.8, wet: 0.55, snow: 0.2 })
    expect(s.units.speed).toBe('mph')
    expect(s.minStartGradePct).toBe(20)
  })

  it('refuses friction that rises from dry to wet, and a caution ratio above danger', () => {
    expect(workshopSettingsSchema.safeParse({ friction: { dry: 0.5, wet: 0.7 } }).success).toBe(false)
    expect(workshopSettingsSchema.safeParse({ powerRatio: { caution: 3, danger: 2 } }).success).toBe(false)
    expect(workshopSettingsSchema.safeParse({ units: { speed: 'knots' } }).success).toBe(false)
  })
})

describe('the example car', () => {
  it('rolls on a tyre within the EU label range 0.0065-0.012 (Regulation (EC) 1222/2009, Annex I Part A)', () => {
    expect(exampleSpec.rollingResistanceCoeff).toBeGreaterThanOrEqual(0.0065)
    expect(exampleSpec.rollingResistanceCoeff).toBeLessThanOrEqual(0.012)
  })
})

describe('parameter names (docs/computation.md#parameters)', () => {
  it('are the eighteen of the contract, each once', () => {
    expect([...PARAMETER_NAMES].sort()).toEqual([
      'batteryChargeLimitA', 'batteryCutoffC', 'batteryDerateStartC', 'batteryDischargeLimitA', 'brakeRegenPct', 'creepSpeedKph',
      'creepTorqueNm', 'inverterCutoffC', 'inverterDerateStartC', 'liftOffRegenPct', 'motorCutoffC', 'motorDerateStartC',
      'powerCapKw', 'regenTorqueLimitNm', 'reverseSpeedLimitKph', 'speedLimitKph', 'throttleProgression', 'torqueCapNm'
    ])
  })
})
