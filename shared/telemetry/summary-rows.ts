// A log's summary as the tester reads it: one row per figure, rounded, with its unit.
import { kwToHp } from '../compute/units'
import type { TelemetrySummary } from './summary'
import { formatFigure } from '../utils/figure-digits'

const withUnit = (x: number | null | undefined, d: number, unit: string) => (x === null || x === undefined ? '—' : `${formatFigure(x, d)} ${unit}`)

export function summaryRows(s: Partial<TelemetrySummary>): { label: string, value: string }[] {
  return [
    { label: 'Samples', value: formatFigure(s.samples, 0) },
    { label: 'Duration', value: withUnit(s.durationS === undefined ? undefined : s.durationS / 60, 1, 'min') },
    { label: 'Peak speed', value: withUnit(s.peakSpeedKph, 0, 'km/h') },
    { label: 'Peak battery power', value: s.peakPowerKw === null || s.peakPowerKw === undefined ? '—' : `${formatFigure(s.peakPowerKw, 1)} kW (${formatFigure(kwToHp(s.peakPowerKw), 0)} hp)` },
    { label: 'Strongest lift-off slowing (0.5 s mean)', value: withUnit(s.peakLiftOffDecelMs2, 2, 'm/s²') },
    { label: 'Energy used', value: withUnit(s.energyOutWh, 0, 'Wh') },
    { label: 'Energy recovered by regen', value: withUnit(s.energyRegenWh, 0, 'Wh') },
    { label: 'Peak motor temperature', value: withUnit(s.peakMotorC, 0, '°C') },
    { label: 'Peak inverter temperature', value: withUnit(s.peakInverterC, 0, '°C') },
    { label: 'Peak battery temperature', value: withUnit(s.peakBatteryC, 0, '°C') },
    { label: 'Furthest roll-back on a hill start', value: withUnit(s.maxRollbackM === undefined ? undefined : s.maxRollbackM * 1000, 0, 'mm') }
  ]
}
