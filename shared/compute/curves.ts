// Chart series: the drive envelope and road load over speed, torque available over temperature.
import type { VehicleSpec } from '../schemas/vehicle-spec'
import type { CarModel } from './acceleration'
import { regenDrive } from './car-model'
import { torqueAvailablePct } from './derate'
import { DERATE_PAIRS } from './parameters'
import { envelopeForceN, motorRpmSpeedMs, motorSpeedRadS } from './envelope'
import type { RoleValues } from './roles'
import { regenTorqueNm, regenWheelForceN } from './regen'
import { roadLoadN } from './roadload'
import type { SpeedCurves, TemperatureCurves } from './types'
import { kphToMs, msToKph } from './units'

export const SPEED_STEP_KPH = 2
const MAX_CHART_KPH = 400
const MAX_TEMPERATURE_POINTS = 150

const finiteOrZero = (x: number) => (Number.isFinite(x) ? x : 0)

export function emptySpeedCurves(): SpeedCurves {
  return { speedKph: [], wheelForceN: [], powerKw: [], roadLoadN: [], liftOffRegenForceN: [] }
}

// From standstill to one step past the lower of speed limit and motor rpm, so the cut-off shows.
// Without the regen role values the lift-off series is left empty rather than drawn at zero.
export function speedCurves(car: CarModel, spec: VehicleSpec, p: RoleValues): SpeedCurves {
  const env = car.envelope
  const endKph = Math.min(MAX_CHART_KPH, env.speedLimitKph, msToKph(motorRpmSpeedMs(env)))
  const points = Math.max(1, Math.ceil(finiteOrZero(endKph) / SPEED_STEP_KPH) + 2)
  const out = emptySpeedCurves()
  const drive = regenDrive(spec, p)
  for (let i = 0; i < points; i++) {
    const kph = i * SPEED_STEP_KPH
    const v = kphToMs(kph)
    const force = envelopeForceN(v, env)
    const omega = motorSpeedRadS(v, env.finalDriveRatio, env.rollingRadiusM)
    out.speedKph.push(kph)
    out.wheelForceN.push(finiteOrZero(force))
    out.powerKw.push(finiteOrZero((force * v) / 1000))
    out.roadLoadN.push(finiteOrZero(roadLoadN(v, car.road)))
    if (drive && p.liftOffRegenPct !== null) {
      out.liftOffRegenForceN.push(finiteOrZero(regenWheelForceN(regenTorqueNm(p.liftOffRegenPct, omega, drive), env.finalDriveRatio, env.rollingRadiusM)))
    }
  }
  return out
}

// From below the lowest derate start (or room temperature) to past the highest cut-off; a sensor whose
// pair the controller lacks gets an empty series.
export function temperatureCurves(p: RoleValues): TemperatureCurves {
  const pairs = DERATE_PAIRS.filter(d => p[d.start] !== null && p[d.cutoff] !== null)
  const out: TemperatureCurves = { temperatureC: [], motorTorquePct: [], inverterTorquePct: [], batteryTorquePct: [] }
  if (pairs.length === 0) return out
  const lo = Math.floor(Math.min(20, ...pairs.map(d => p[d.start]!)) / 5) * 5 - 5
  const hi = Math.ceil(Math.max(...pairs.map(d => p[d.cutoff]!)) / 5) * 5 + 10
  const step = Math.max(1, Math.ceil((hi - lo) / MAX_TEMPERATURE_POINTS))
  for (let t = lo; t <= hi; t += step) {
    out.temperatureC.push(t)
    for (const d of pairs) out[`${d.sensor}TorquePct`].push(torqueAvailablePct(t, p[d.start]!, p[d.cutoff]!))
  }
  return out
}
