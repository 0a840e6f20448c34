// What each safety rule is called on screens and in the history, and the unit of its value and limit.
import type { RuleId } from './types'

export const ruleTitles: Record<RuleId, { title: string, unit: string }> = {
  'regen-grip-wet': { title: 'Regen against grip, wet road', unit: 'm/s²' },
  'regen-grip-snow': { title: 'Regen against grip, snow', unit: 'm/s²' },
  'stop-lamp': { title: 'Stop lamps and regen (UN R13-H)', unit: 'm/s²' },
  'power-ratio': { title: 'Power against the original engine', unit: '×' },
  'tyre-speed': { title: 'Tyre speed rating', unit: 'km/h' },
  'tyre-load': { title: 'Tyre load rating', unit: 'kg' },
  'current-limits': { title: 'Controller and pack currents', unit: 'A' },
  'hill-start': { title: 'Hill start', unit: '%' },
  'creep-hold': { title: 'Creep on a slope', unit: '%' },
  'derate-band': { title: 'Thermal derate band', unit: '°C' }
}
