import { describe, expect, it } from 'vitest'
import type { TelemetrySample } from '../../shared/telemetry/columns'
import { summarise } from '../../shared/telemetry/summary'
import { TelemetryDownsampler } from '../../shared/telemetry/downsample'

// A sample with everything quiet; each test sets what it is about.
const at = (timeS: number, o: Partial<TelemetrySample> = {}): TelemetrySample => ({
  timeS, speedKph: 0, motorTorqueNm: 0, motorRpm: 0, pedalPct: 20, brake: 0,
  motorC: 30, inverterC: 28, batteryC: 22, batteryV: 350, batteryA: 0, ...o
})

// Samples every dt from t0 to t1 inclusive, with speed (m/s) and other fields as functions of time.
function trace(t0: number, t1: number, dt: number, f: (t: number) => Partial<TelemetrySample> & { v?: number }): TelemetrySample[] {
  const out: TelemetrySample[] = []
  const n = Math.round((t1 - t0) / dt)
  for (let i = 0; i <= n; i++) {
    const t = t0 + i * dt
    const { v, ...rest } = f(t)
    out.push(at(Number(t.toFixed(9)), { ...(v === undefined ? {} : { speedKph: v * 3.6 }), ...rest }))
  }
  return out
}

describe('lift-off deceleration (pedal 0, brake 0, above 10 km/h, mean over 0.5 s)', () => {
  it('finds a constant deceleration exactly (closed form: v = v0 − a·t)', () => {
    const cruise = trace(0, 2, 0.01, () => ({ v: 25, pedalPct: 30 }))
    const liftOff = trace(2.01, 6, 0.01, t => ({ v: 25 - 2.5 * (t - 2), pedalPct: 0 }))
    expect(summarise([...cruise, ...liftOff]).peakLiftOffDecelMs2).toBeCloseTo(2.5, 9)
  })

  it('smooths a short spike over 0.5 s: 0.3 s at 8 m/s² in 2 m/s² reads (8·0.3 + 2·0.2)/0.5 = 5.6', () => {
    const a = (t: number) => (t > 1 && t <= 1.3 ? 8 : 2)
    let v = 20
    const samples = trace(0, 3, 0.01, (t) => {
      if (t > 0) v -= a(t) * 0.01
      return { v, pedalPct: 0 }
    })
    expect(summarise(samples).peakLiftOffDecelMs2).toBeCloseTo(5.6, 6)
  })

  it('ignores braking, pressing the pedal and speeds at or under 10 km/h', () => {
    const braking = trace(0, 2, 0.01, t => ({ v: 20 - 6 * t, pedalPct: 0, brake: 1 }))
    const pedal = trace(2.01, 4, 0.01, t => ({ v: 20 - 5 * (t - 2), pedalPct: 5 }))
    const slow = trace(4.01, 5, 0.01, t => ({ v: 2.7 - 2 * (t - 4), pedalPct: 0 }))
    expect(summarise([...braking, ...pedal, ...slow]).peakLiftOffDecelMs2).toBeNull()
  })

  it('needs a full 0.5 s of unbroken lift-off before it reads a value', () => {
    const blip = trace(0, 0.4, 0.01, t => ({ v: 20 - 9 * t, pedalPct: 0 }))
    expect(summarise(blip).peakLiftOffDecelMs2).toBeNull()
  })
})

describe('power and energy on the battery side (trapezoid rule on V·I)', () => {
  it('a constant-power pull: P = 70 kW for the closed-form time t = m·(v2² − v1²)/(2P)', () => {
    // REFERENCES: constant power from v1 to v2, no resistance, t = m(v2² − v1²)/(2P).
    const m = 1200
    const P = 70_000
    const v1 = 5
    const v2 = 25
    const T = (m * (v2 ** 2 - v1 ** 2)) / (2 * P)
    const samples = trace(0, T, T / 1000, t => ({ v: Math.sqrt(v1 ** 2 + (2 * P * t) / m), batteryV: 350, batteryA: P / 350, pedalPct: 100 }))
    const s = summarise(samples)
    expect(T).toBeCloseTo(5.142857, 5)
    expect(s.durationS).toBeCloseTo(T, 8)
    expect(s.peakPowerKw).toBeCloseTo(70, 9)
    expect(s.energyOutWh).toBeCloseTo((P * T) / 3600, 6)
    expect(s.peakSpeedKph).toBeCloseTo(v2 * 3.6, 6)
    expect(s.energyRegenWh).toBe(0)
  })

  it('counts regen (negative current) separately: 350 V × 50 A for 20 s = 97.22 Wh', () => {
    const out = trace(0, 10, 0.1, () => ({ batteryA: 100 }))
    const regen = trace(10.1, 30.1, 0.1, () => ({ batteryA: -50 }))
    const s = summarise([...out, ...regen])
    // 10 s at 35 kW plus the half-interval ramp from +35 kW to −17.5 kW across 10.0 → 10.1 s.
    expect(s.energyOutWh).toBeCloseTo((35_000 * 10 + 35_000 * 0.05) / 3600, 6)
    expect(s.energyRegenWh).toBeCloseTo((17_500 * 20 + 17_500 * 0.05) / 3600, 6)
    expect(s.peakPowerKw).toBeCloseTo(35, 9)
  })

  it('takes the peak temperatures of each sensor', () => {
    const s = summarise(trace(0, 10, 0.5, t => ({ motorC: 30 + t * 4, inverterC: 60 - (t - 5) ** 2, batteryC: 25 + Math.sin(t) })))
    expect(s.peakMotorC).toBeCloseTo(70, 9)
    expect(s.peakInverterC).toBeCloseTo(60, 9)
    expect(s.peakBatteryC).toBeCloseTo(25 + Math.sin(1.5), 9)
  })
})

describe('roll-back on a hill start', () => {
  it('a triangle 0 → −0.4 m/s → 0 over 1 s rolls back 0.4·1/2 = 0.2 m', () => {
    const hold = trace(0, 1, 0.01, () => ({ brake: 1 }))
    const roll = trace(1.01, 2, 0.01, t => ({ v: -0.4 * (1 - Math.abs(1 - 2 * (t - 1))), motorTorqueNm: 40 }))
    const away = trace(2.01, 4, 0.01, t => ({ v: 1.5 * (t - 2), motorTorqueNm: 120 }))
    expect(summarise([...hold, ...roll, ...away]).maxRollbackM).toBeCloseTo(0.2, 9)
  })

  it('a sine roll-back −u·sin(πt/T) covers 2uT/π, to the sampling error', () => {
    const u = 0.3
    const T = 1.2
    const roll = trace(0, T, 0.005, t => ({ v: -u * Math.sin((Math.PI * t) / T), motorTorqueNm: 30 }))
    expect(summarise(roll).maxRollbackM).toBeCloseTo((2 * u * T) / Math.PI, 4)
  })

  it('takes the worst of several starts, not their sum, and ignores reversing under power', () => {
    const first = trace(0, 1, 0.01, t => ({ v: -0.2 * (1 - Math.abs(1 - 2 * t)), motorTorqueNm: 10 }))
    const forward = trace(1.01, 2, 0.01, t => ({ v: 0.5 * (1 - Math.abs(1 - 2 * (t - 1))), motorTorqueNm: 50 }))
    const second = trace(2.01, 4, 0.01, t => ({ v: -0.5 * (1 - Math.abs(1 - (t - 2))), motorTorqueNm: 10 }))
    const reversing = trace(4.01, 10, 0.01, () => ({ v: -2, motorTorqueNm: -60 }))
    const s = summarise([...first, ...forward, ...second, ...reversing])
    expect(s.maxRollbackM).toBeCloseTo(0.5, 6) // 0.5 m/s peak over 2 s: 0.5·2/2
  })

  it('counts the part of a step across zero that was backwards (linear crossing)', () => {
    // From +0.1 to −0.3 m/s in 0.1 s: the negative part is a triangle 0.3 m/s high and 0.075 s wide.
    const s = summarise([at(0, { speedKph: 0.36 }), at(0.1, { speedKph: -1.08 }), at(0.2, { speedKph: 0.36 })])
    expect(s.maxRollbackM).toBeCloseTo(0.3 * 0.075 / 2 * 2, 12)
  })
})

describe('the rest of the summary', () => {
  it('counts samples and duration from the first to the last time stamp', () => {
    const s = summarise(trace(12.5, 112.5, 0.1, () => ({})))
    expect(s.samples).toBe(1001)
    expect(s.durationS).toBeCloseTo(100, 9)
  })

  it('refuses time that stands still or goes back', () => {
    expect(() => summarise([at(1), at(1)])).toThrow(/does not follow/)
    expect(() => summarise([at(2), at(1)])).toThrow(/does not follow/)
  })
})

describe('the chart series', () => {
  it('keeps at most the limit, evenly spaced by sample, starting with the first', () => {
    const d = new TelemetryDownsampler(100)
    for (let i = 0; i < 10_000; i++) d.add(at(i / 10, { speedKph: i }))
    const s = d.result()
    expect(s.timeS.length).toBeLessThan(100)
    expect(s.timeS.length).toBeGreaterThan(40)
    expect(s.speedKph[0]).toBe(0)
    const steps = new Set(s.speedKph.slice(1).map((x, i) => x - s.speedKph[i]!))
    expect(steps.size).toBe(1)
  })
})
