// power-ratio: the drive unit's power cap against what the car's brakes and chassis were built for.
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function powerRatio(x: RuleInput): Warning[] {
  const ratio = x.figures.powerRatioToOriginal
  const { caution, danger } = x.settings.powerRatio
  if (ratio === null || ratio <= caution) return []
  const power = `${n(x.parameters.powerCapKw ?? ratio * x.spec.originalEnginePowerKw)} kW against ${n(x.spec.originalEnginePowerKw)} kW`
  if (ratio > danger) {
    return [warning('power-ratio', 'danger',
      `The drive unit may deliver ${n(ratio)} times the original engine's power (${power}). The brakes, tyres, suspension, driveshafts and mounts were built for far less and can fade, break or let go under it. Uprate them, or lower the power cap, before the car is driven hard.`,
      ratio, danger)]
  }
  return [warning('power-ratio', 'caution',
    `The drive unit may deliver ${n(ratio)} times the original engine's power (${power}). Have the brakes, tyres, suspension and driveshafts checked for the extra power and torque.`,
    ratio, caution)]
}
