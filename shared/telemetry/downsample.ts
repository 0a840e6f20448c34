// A log thinned for the browser's chart: at most `limit` points, evenly spaced by sample, kept while streaming
// (every stride-th sample; when the buffer fills, every other point goes and the stride doubles).
import type { TelemetrySample } from './columns'

export interface TelemetrySeries {
  timeS: number[]
  speedKph: number[]
  motorTorqueNm: number[]
  motorC: number[]
  inverterC: number[]
  batteryC: number[]
}

export const SERIES_LIMIT = 800

const round = (x: number) => Math.round(x * 100) / 100

export class TelemetryDownsampler {
  private points: TelemetrySample[] = []
  private stride = 1
  private seen = 0

  constructor(private readonly limit = SERIES_LIMIT) {}

  add(x: TelemetrySample): void {
    if (this.seen++ % this.stride !== 0) return
    this.points.push(x)
    if (this.points.length >= this.limit) {
      this.points = this.points.filter((_, i) => i % 2 === 0)
      this.stride *= 2
    }
  }

  result(): TelemetrySeries {
    const p = this.points
    return {
      timeS: p.map(x => round(x.timeS)),
      speedKph: p.map(x => round(x.speedKph)),
      motorTorqueNm: p.map(x => round(x.motorTorqueNm)),
      motorC: p.map(x => round(x.motorC)),
      inverterC: p.map(x => round(x.inverterC)),
      batteryC: p.map(x => round(x.batteryC))
    }
  }
}
