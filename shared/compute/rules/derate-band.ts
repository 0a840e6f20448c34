// derate-band: thermal settings that leave too narrow a band between derate start and cut-off.
import { derateBandC } from '../derate'
import { DERATE_PAIRS } from '../parameters'
import type { Warning } from '../types'
import { n, warning, type RuleInput } from './context'

const SENSOR_WORDS = { motor: 'motor', inverter: 'inverter', battery: 'battery pack' } as const

export function derateBand(x: RuleInput): Warning[] {
  const min = x.settings.minDerateBandC
  const out: Warning[] = []
  for (const pair of DERATE_PAIRS) {
    const start = x.parameters[pair.start]
    const cutoff = x.parameters[pair.cutoff]
    if (start === null || cutoff === null) continue
    const band = derateBandC(start, cutoff)
    // A band of zero or less is already a hard error on the parameters.
    if (band <= 0 || band >= min) continue
    out.push(warning('derate-band', 'caution',
      `When the ${SENSOR_WORDS[pair.sensor]} gets hot, torque falls from full at ${n(start)} °C to nothing at ${n(cutoff)} °C, a band of only ${n(band)} °C against the workshop's ${n(min)} °C: on a long climb or a hot day power could vanish almost at once instead of fading, for example mid-overtake. Widen the gap between derate start and cut-off.`,
      band, min))
  }
  return out
}
