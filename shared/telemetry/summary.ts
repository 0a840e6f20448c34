// The summary of a road-test log (docs/computation.md#telemetry-summary), built one sample at a time so a 50 MB file is never held whole.
import type { TelemetrySample } from './columns'

export interface TelemetrySummary {
  samples: number
  durationS: number
  peakSpeedKph: number | null
  peakPowerKw: number | null // battery side: V·I, discharging
  peakLiftOffDecelMs2: number | null // pedal 0, brake 0, above 10 km/h, mean over 0.5 s
  energyOutWh: number
  energyRegenWh: number
  peakMotorC: number | null
  peakInverterC: number | null
  peakBatteryC: number | null
  maxRollbackM: number // furthest the car rolled backwards while the motor was not driving it backwards
}

export const LIFT_OFF_MIN_SPEED_KPH = 10
export const LIFT_OFF_WINDOW_S = 0.5
const EPS = 1e-9

const max = (a: number | null, b: number) => (a === null || b > a ? b : a)

// Area of the negative part of a straight line from v0 to v1 over dt (exact for linear speed).
function backwardsArea(v0: number, v1: number, dt: number): number {
  if (v0 >= 0 && v1 >= 0) return 0
  if (v0 <= 0 && v1 <= 0) return (-(v0 + v1) / 2) * dt
  const neg = Math.min(v0, v1)
  return (neg * neg) / (Math.abs(v0) + Math.abs(v1)) * dt / 2
}

export class TelemetrySummariser {
  private s: TelemetrySummary = {
    samples: 0, durationS: 0, peakSpeedKph: null, peakPowerKw: null, peakLiftOffDecelMs2: null,
    energyOutWh: 0, energyRegenWh: 0, peakMotorC: null, peakInverterC: null, peakBatteryC: null, maxRollbackM: 0
  }

  private first: TelemetrySample | null = null
  private prev: TelemetrySample | null = null
  private liftOff: { t: number, v: number }[] = [] // the current lift-off stretch, trimmed to the window
  private rollback = 0

  // Throws a plain message when time does not move forward; the caller names the row.
  add(x: TelemetrySample): void {
    const p = this.prev
    if (p && x.timeS <= p.timeS) throw new Error(`time_s ${x.timeS} does not follow ${p.timeS}`)
    const s = this.s
    s.samples++
    this.first ??= x
    s.durationS = x.timeS - this.first.timeS
    s.peakSpeedKph = max(s.peakSpeedKph, x.speedKph)
    const powerKw = (x.batteryV * x.batteryA) / 1000
    s.peakPowerKw = max(s.peakPowerKw, powerKw)
    s.peakMotorC = max(s.peakMotorC, x.motorC)
    s.peakInverterC = max(s.peakInverterC, x.inverterC)
    s.peakBatteryC = max(s.peakBatteryC, x.batteryC)
    if (p) this.integrate(p, x)
    this.trackLiftOff(x)
    this.prev = x
  }

  // Energy by the trapezoid rule on discharge and charge power separately; roll-back likewise on speed.
  private integrate(p: TelemetrySample, x: TelemetrySample) {
    const dt = x.timeS - p.timeS
    const p0 = p.batteryV * p.batteryA
    const p1 = x.batteryV * x.batteryA
    this.s.energyOutWh += ((Math.max(0, p0) + Math.max(0, p1)) / 2) * dt / 3600
    this.s.energyRegenWh += ((Math.max(0, -p0) + Math.max(0, -p1)) / 2) * dt / 3600
    const area = x.motorTorqueNm >= 0 ? backwardsArea(p.speedKph / 3.6, x.speedKph / 3.6, dt) : 0
    if (area > 0) {
      this.rollback += area
      if (this.rollback > this.s.maxRollbackM) this.s.maxRollbackM = this.rollback
    } else {
      this.rollback = 0
    }
  }

  // Mean deceleration over the last 0.5 s of an unbroken lift-off stretch (a moving window over samples).
  private trackLiftOff(x: TelemetrySample) {
    const liftingOff = x.pedalPct === 0 && x.brake === 0 && x.speedKph > LIFT_OFF_MIN_SPEED_KPH
    if (!liftingOff) {
      this.liftOff.length = 0
      return
    }
    const w = this.liftOff
    w.push({ t: x.timeS, v: x.speedKph / 3.6 })
    while (w.length > 1 && w[1]!.t <= x.timeS - LIFT_OFF_WINDOW_S + EPS) w.shift()
    const start = w[0]!
    const span = x.timeS - start.t
    if (span + EPS >= LIFT_OFF_WINDOW_S) {
      this.s.peakLiftOffDecelMs2 = max(this.s.peakLiftOffDecelMs2, (start.v - x.speedKph / 3.6) / span)
    }
  }

  result(): TelemetrySummary {
    return { ...this.s }
  }
}

// The whole summary of samples already in memory (tests, the demo-log script).
export function summarise(samples: Iterable<TelemetrySample>): TelemetrySummary {
  const s = new TelemetrySummariser()
  for (const x of samples) s.add(x)
  return s.result()
}
