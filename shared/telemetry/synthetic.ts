// Synthetic controller logs for the demo cars, the tests and the benchmark: a plausible road-test drive
// (hill start with a little roll-back, full-power pull, lift-off regen, cruise, brake regen, creep) from
// simple physics. Invented data, never a real car's.
import { TELEMETRY_COLUMNS, type TelemetrySample } from './columns'

export interface SyntheticCar {
  massKg: number // test mass
  rollingRadiusM: number
  finalDriveRatio: number
  powerCapKw: number
  torqueCapNm: number
  liftOffDecelMs2: number
  brakeRegenDecelMs2: number
  packVoltageV: number
  creepSpeedKph: number
}

export interface SyntheticOptions { hz?: number, laps?: number, ambientC?: number, rollbackM?: number, startGradePct?: number }

const G = 9.80665

export function syntheticDrive(car: SyntheticCar, o: SyntheticOptions = {}): TelemetrySample[] {
  const hz = o.hz ?? 10
  const dt = 1 / hz
  const ambient = o.ambientC ?? 14
  const out: TelemetrySample[] = []
  let t = 0
  let v = 0 // m/s, signed
  const heat = { motor: ambient + 6, inverter: ambient + 4, battery: ambient + 2 }
  const grade = Math.atan((o.startGradePct ?? 12) / 100)
  const rollback = o.rollbackM ?? 0.08

  const push = (pedal: number, brake: 0 | 1, wheelForceN: number) => {
    const torque = (wheelForceN * car.rollingRadiusM) / car.finalDriveRatio
    const mechKw = (wheelForceN * v) / 1000
    const battKw = mechKw >= 0 ? mechKw / 0.9 + 0.4 : mechKw * 0.85 + 0.4
    const amps = (battKw * 1000) / car.packVoltageV
    const load = Math.abs(mechKw) / Math.max(1, car.powerCapKw)
    heat.motor += (ambient + 6 + 80 * load - heat.motor) * dt / 240
    heat.inverter += (ambient + 4 + 55 * load - heat.inverter) * dt / 160
    heat.battery += (ambient + 2 + 25 * load - heat.battery) * dt / 900
    out.push({
      timeS: Math.round(t * 1000) / 1000, speedKph: v * 3.6, motorTorqueNm: torque,
      motorRpm: (v / car.rollingRadiusM) * car.finalDriveRatio * 60 / (2 * Math.PI), pedalPct: pedal, brake,
      motorC: heat.motor, inverterC: heat.inverter, batteryC: heat.battery,
      batteryV: car.packVoltageV - amps * 0.08, batteryA: amps
    })
    t += dt
  }
  const run = (seconds: number, step: () => [number, 0 | 1, number]) => {
    for (let i = 0; i < Math.round(seconds * hz); i++) push(...step())
  }

  for (let lap = 0; lap < (o.laps ?? 1); lap++) {
    // Hill start: held on the brake, released, rolls back `rollback` metres (triangle 0 → −u → 0), pulls away.
    v = 0
    run(2, () => [0, 1, 0])
    const rollS = 1
    const peak = (2 * rollback) / rollS
    let i = 0
    const n = Math.round(rollS * hz)
    run(rollS, () => { i++; v = -peak * (1 - Math.abs(1 - (2 * i) / n)); return [20, 0, car.massKg * G * Math.sin(grade) * 0.3] })
    v = 0
    run(4, () => { const f = Math.min(car.torqueCapNm * car.finalDriveRatio / car.rollingRadiusM, car.massKg * 2.2); v += (f / car.massKg - G * Math.sin(grade)) * dt; return [60, 0, f] })
    // Full-power pull to 90 km/h: torque-limited, then constant power.
    run(60, () => {
      if (v >= 25) return [30, 0, 300]
      const f = Math.min(car.torqueCapNm * car.finalDriveRatio / car.rollingRadiusM, (car.powerCapKw * 1000) / Math.max(v, 0.5))
      v += ((f - 0.012 * car.massKg * G) / (car.massKg * 1.05)) * dt
      return [100, 0, f]
    })
    // Lift-off regen down to 30 km/h.
    run(60, () => { if (v <= 8.3) return [20, 0, 250]; v -= car.liftOffDecelMs2 * dt; return [0, 0, -car.massKg * car.liftOffDecelMs2] })
    // Cruise at about 60 km/h.
    run(90, () => { v += (16.7 - v) * dt * 0.3; return [25, 0, 350 + (16.7 - v) * car.massKg * 0.3] })
    // Brake regen to a stop, then creep.
    run(40, () => { if (v <= 0.05) { v = 0; return [0, 1, 0] } v = Math.max(0, v - car.brakeRegenDecelMs2 * dt); return [0, 1, -car.massKg * car.brakeRegenDecelMs2] })
    run(10, () => { v += (car.creepSpeedKph / 3.6 - v) * dt; return [0, 0, 180] })
  }
  return out
}

const fixed = (x: number, d: number) => Number(x.toFixed(d)).toString()

export function telemetryCsv(samples: readonly TelemetrySample[], lineEnd = '\n'): string {
  const lines = [TELEMETRY_COLUMNS.join(',')]
  for (const s of samples) {
    lines.push([fixed(s.timeS, 3), fixed(s.speedKph, 3), fixed(s.motorTorqueNm, 2), fixed(s.motorRpm, 1), fixed(s.pedalPct, 1), s.brake,
      fixed(s.motorC, 2), fixed(s.inverterC, 2), fixed(s.batteryC, 2), fixed(s.batteryV, 2), fixed(s.batteryA, 2)].join(','))
  }
  return lines.join(lineEnd) + lineEnd
}
