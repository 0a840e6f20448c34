import { describe, expect, it } from 'vitest'
import { chargeTime10to80H, cRate, peakDischargeCurrentA } from '../../shared/compute/currents'
import { derateBandC, torqueAvailablePct } from '../../shared/compute/derate'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { motorSpeedRadS } from '../../shared/compute/envelope'
import { regenPackCurrentA, regenTorqueNm, type RegenDrive } from '../../shared/compute/regen'
import { kphToMs } from '../../shared/compute/units'
import { defaultParameters, marrick110 } from '../../shared/platforms/index'

const drive: RegenDrive = { regenTorqueLimitNm: 200, batteryChargeLimitA: 100, packNominalVoltageV: 350, drivetrainEfficiency: 0.9 }

describe('regen torque (docs/computation.md#regen)', () => {
  it('is regenTorqueLimitNm·pct/100 when the charge limit does not bite', () => {
    expect(regenTorqueNm(20, 100, drive)).toBeCloseTo(40, 12)
  })

  it('is capped so that pack charge current stays at batteryChargeLimitA', () => {
    const omega = 600
    const t = regenTorqueNm(100, omega, drive)
    expect(t).toBeLessThan(200)
    expect(regenPackCurrentA(t, omega, drive)).toBeCloseTo(100, 9)
  })

  it.each([0, 25, 60, 100])('never pushes more than the charge limit, at %d %', (pct) => {
    for (const omega of [50, 200, 400, 800, 1200]) {
      expect(regenPackCurrentA(regenTorqueNm(pct, omega, drive), omega, drive)).toBeLessThanOrEqual(100 + 1e-9)
    }
  })
})

describe('regen deceleration at 50 km/h from evaluate', () => {
  const base = defaultParameters(marrick110)

  it('lift-off decel is T·G/(r·m) with T = regenTorqueLimitNm·liftOffRegenPct/100', () => {
    const e = evaluate(exampleSpec, marrick110, { ...base, liftOffRegenPct: 30 })
    const r = e.figures.rollingRadiusM!
    const torque = (base.regenTorqueLimitNm * 30) / 100
    expect(e.figures.liftOffDecelMs2).toBeCloseTo((torque * exampleSpec.finalDriveRatio) / r / e.figures.testMassKg!, 9)
  })

  it('a low charge limit caps the decel, and the pack current then equals the limit', () => {
    const e = evaluate(exampleSpec, marrick110, { ...base, brakeRegenPct: 100, batteryChargeLimitA: 20 })
    const r = e.figures.rollingRadiusM!
    const omega = motorSpeedRadS(kphToMs(50), exampleSpec.finalDriveRatio, r)
    const torque = (e.figures.brakeRegenDecelMs2! * e.figures.testMassKg! * r) / exampleSpec.finalDriveRatio
    expect(torque).toBeLessThan(base.regenTorqueLimitNm)
    expect((torque * omega * exampleSpec.drivetrainEfficiency) / exampleSpec.packNominalVoltageV).toBeCloseTo(20, 6)
  })
})

describe('currents and charging (docs/computation.md#currents)', () => {
  it('peak discharge current is P/(η·V): 100 kW at 90 % and 350 V draws 317 A', () => {
    expect(peakDischargeCurrentA(100, 0.9, 350)).toBeCloseTo(100_000 / (0.9 * 350), 9)
    expect(peakDischargeCurrentA(100, 0.9, 350)).toBeCloseTo(317.46, 2)
  })

  it('charge time 10 → 80 % is 0.7·capacity/(charger·0.9)', () => {
    expect(chargeTime10to80H(40, 7.4)).toBeCloseTo((0.7 * 40) / (7.4 * 0.9), 12)
    expect(chargeTime10to80H(40, 14.8)).toBeCloseTo(chargeTime10to80H(40, 7.4) / 2, 12)
  })

  it('1C is the current that delivers rated capacity in one hour (IEC 61434)', () => {
    const oneC = (40_000 / 350) // A, for 40 kWh at 350 V
    expect(cRate(oneC, 40, 350)).toBeCloseTo(1, 12)
    expect(cRate(2 * oneC, 40, 350)).toBeCloseTo(2, 12)
  })
})

describe('thermal derate (docs/computation.md#derate)', () => {
  it('is 100 % up to derate start, 0 % from cut-off, and linear between', () => {
    expect(torqueAvailablePct(20, 120, 150)).toBe(100)
    expect(torqueAvailablePct(120, 120, 150)).toBe(100)
    expect(torqueAvailablePct(135, 120, 150)).toBeCloseTo(50, 12)
    expect(torqueAvailablePct(144, 120, 150)).toBeCloseTo(20, 12)
    expect(torqueAvailablePct(150, 120, 150)).toBe(0)
    expect(torqueAvailablePct(170, 120, 150)).toBe(0)
  })

  it('drops straight to zero when there is no band at all', () => {
    expect(derateBandC(150, 150)).toBe(0)
    expect(torqueAvailablePct(149.9, 150, 150)).toBe(100)
    expect(torqueAvailablePct(150, 150, 150)).toBe(0)
  })
})
