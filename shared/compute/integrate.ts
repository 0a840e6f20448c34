// Time to reach given speeds from an acceleration law a(v), by classical fourth-order Runge-Kutta.

export type AccelerationLaw = (speedMs: number) => number

export interface IntegrateOptions {
  targetsMs: readonly number[]
  startMs?: number
  stepS?: number
  maxTimeS?: number
}

export const DEFAULT_STEP_S = 0.01
export const DEFAULT_MAX_TIME_S = 60

// Integrates dv/dt = a(v) from startMs; each target gets the first time it is reached, or null.
export function timesToSpeeds(law: AccelerationLaw, opts: IntegrateOptions): (number | null)[] {
  const dt = opts.stepS ?? DEFAULT_STEP_S
  const maxTime = opts.maxTimeS ?? DEFAULT_MAX_TIME_S
  const order = opts.targetsMs.map((v, i) => ({ v, i })).sort((a, b) => a.v - b.v)
  const times: (number | null)[] = opts.targetsMs.map(() => null)
  let v = opts.startMs ?? 0
  let t = 0
  let next = 0
  while (next < order.length && order[next]!.v <= v) times[order[next++]!.i] = 0
  while (next < order.length && t < maxTime) {
    const k1 = law(v)
    const k2 = law(v + 0.5 * dt * k1)
    const k3 = law(v + 0.5 * dt * k2)
    const k4 = law(v + dt * k3)
    const vNext = v + (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4)
    // With a(v) depending on speed alone, speed that stops rising never rises again.
    if (!(vNext > v)) break
    while (next < order.length && order[next]!.v <= vNext) {
      const tHit = t + (dt * (order[next]!.v - v)) / (vNext - v)
      times[order[next++]!.i] = tHit <= maxTime ? tHit : null
    }
    v = vNext
    t += dt
  }
  return times
}
