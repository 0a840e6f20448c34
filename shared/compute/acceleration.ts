// Full-power acceleration from rest and top speed on the level (docs/computation.md#acceleration).
import { envelopeForceUncutN, motorRpmSpeedMs, type DriveEnvelope } from './envelope'
import { timesToSpeeds, DEFAULT_MAX_TIME_S, type AccelerationLaw } from './integrate'
import { roadLoadN, type RoadLoadInputs } from './roadload'
import { accelerationMs2, type Chassis, type DrivenAxle } from './traction'
import { kphToMs, msToKph } from './units'

export interface CarModel {
  envelope: DriveEnvelope
  road: RoadLoadInputs
  chassis: Chassis
  axle: DrivenAxle
  mu: number
  inertialMassKg: number // m·rotatingMassFactor
}

export type TopSpeedLimit = 'speed limit' | 'motor rpm' | 'road load'

// a = min(motor-limited, traction-limited) minus road load, over the inertial mass. The rpm and
// speed-limit cut-offs are left out: callers stop at or below the top speed, where they never bite.
export function accelerationLaw(car: CarModel): AccelerationLaw {
  return (v) => accelerationMs2({
    motorForceN: envelopeForceUncutN(v, car.envelope),
    resistanceN: roadLoadN(v, car.road),
    inertialMassKg: car.inertialMassKg,
    mu: car.mu,
    chassis: car.chassis,
    axle: car.axle
  })
}

// The lowest of the speed limit, the motor's max rpm and the speed where drive meets road load.
export function topSpeed(car: CarModel): { speedMs: number, limitedBy: TopSpeedLimit } {
  const limitMs = kphToMs(car.envelope.speedLimitKph)
  const rpmMs = motorRpmSpeedMs(car.envelope)
  const capMs = Math.min(limitMs, rpmMs)
  const capBy: TopSpeedLimit = limitMs <= rpmMs ? 'speed limit' : 'motor rpm'
  const net = accelerationLaw(car)
  if (net(capMs) > 0) return { speedMs: capMs, limitedBy: capBy }
  if (!(net(0) > 0)) return { speedMs: 0, limitedBy: 'road load' }
  let lo = 0
  let hi = capMs
  // Net acceleration falls with speed, so bisection finds the one balance point.
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi)
    if (net(mid) > 0) lo = mid
    else hi = mid
  }
  return { speedMs: lo, limitedBy: 'road load' }
}

export interface AccelerationFigures {
  zeroTo50S: number | null
  zeroTo100S: number | null
  topSpeedKph: number
  topSpeedLimitedBy: TopSpeedLimit
  reasons: { zeroTo50S?: string, zeroTo100S?: string }
}

const fmt = (x: number) => x.toFixed(0)
const LIMIT_WORDS: Record<TopSpeedLimit, string> = { 'speed limit': 'the speed limit', 'motor rpm': "the motor's top rpm", 'road load': 'road load' }

export function analyseAcceleration(car: CarModel): AccelerationFigures {
  const top = topSpeed(car)
  const topKph = msToKph(top.speedMs)
  const reasons: AccelerationFigures['reasons'] = {}
  const reachable = (kph: number) => kph < topKph || (kph <= topKph && top.limitedBy !== 'road load')
  const targets = [50, 100].filter(reachable)
  const times = timesToSpeeds(accelerationLaw(car), { targetsMs: targets.map(kphToMs) })
  const timeFor = (kph: number, key: keyof AccelerationFigures['reasons']): number | null => {
    const i = targets.indexOf(kph)
    const t = i < 0 ? null : times[i] ?? null
    if (i < 0) reasons[key] = `Top speed is about ${fmt(topKph)} km/h (limited by ${LIMIT_WORDS[top.limitedBy]}), so ${kph} km/h is never reached`
    else if (t === null) reasons[key] = `Takes longer than ${DEFAULT_MAX_TIME_S} s to reach ${kph} km/h`
    return t
  }
  return {
    zeroTo50S: timeFor(50, 'zeroTo50S'),
    zeroTo100S: timeFor(100, 'zeroTo100S'),
    topSpeedKph: topKph,
    topSpeedLimitedBy: top.limitedBy,
    reasons
  }
}
