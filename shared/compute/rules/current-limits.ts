// current-limits: the controller's battery current limits against the pack's, and the power cap against both.
import { currentLimitedPowerKw } from '../currents'
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

export function currentLimits(x: RuleInput): Warning[] {
  const { batteryDischargeLimitA: discharge, batteryChargeLimitA: charge } = x.parameters
  const { packMaxDischargeCurrentA: packOut, packMaxChargeCurrentA: packIn } = x.spec
  const out: Warning[] = []
  if (discharge !== null && discharge > packOut) {
    out.push(warning('current-limits', 'danger',
      `The controller may draw up to ${n(discharge)} A from the battery, but the pack is rated for ${n(packOut)} A: under full power the pack can overheat, age fast or trip its own protection and cut power mid-overtake. Lower the battery discharge limit to the pack's rating.`,
      discharge, packOut))
  }
  if (charge !== null && charge > packIn) {
    out.push(warning('current-limits', 'danger',
      `Regen may push up to ${n(charge)} A into the battery, but the pack accepts ${n(packIn)} A: braking downhill, or with a cold or full pack, can damage cells or make the pack cut regen without notice. Lower the battery charge limit to the pack's rating.`,
      charge, packIn))
  }
  const peak = x.figures.peakDischargeCurrentA
  if (peak !== null && discharge !== null && peak > discharge) {
    const reachable = currentLimitedPowerKw(discharge, x.spec.drivetrainEfficiency, x.spec.packNominalVoltageV)
    out.push(warning('current-limits', 'info',
      `At the power cap the battery would have to supply about ${n(peak)} A, more than the controller's ${n(discharge)} A discharge limit: the car will pull with about ${n(reachable)} kW at most, less than the performance figures assume.`,
      peak, discharge))
  }
  return out
}
