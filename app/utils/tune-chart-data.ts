// Chart series for the tune sheet. A compared (baseline) profile is drawn dashed with hollow markers of
// another shape, so the two read apart in print, in greyscale and for colour-blind readers.
import type { ChartDataset, PointStyle, ScriptableContext } from 'chart.js'
import type { Curves } from '~~/shared/compute/types'

export interface CurveLabels { current?: string, baseline?: string }
export type LineDataset = ChartDataset<'line', { x: number, y: number }[]>
export type SeriesRole = 'current' | 'baseline'

// Copper, graphite and Okabe-Ito blue: distinct in hue and in lightness.
export const seriesColours = { copper: '#a4551f', graphite: '#2a2926', blue: '#0072B2' } as const

interface SeriesSpec { name: string, xs: number[], ys: number[], colour: string, marker: PointStyle }

const MARKERS_PER_LINE = 12

export function points(xs: number[], ys: number[]): { x: number, y: number }[] {
  const n = Math.min(xs.length, ys.length)
  const out: { x: number, y: number }[] = []
  for (let i = 0; i < n; i++) if (Number.isFinite(xs[i]) && Number.isFinite(ys[i])) out.push({ x: xs[i]!, y: ys[i]! })
  return out
}

export function lineDataset(s: SeriesSpec, role: SeriesRole, labels: CurveLabels): LineDataset {
  const data = points(s.xs, s.ys)
  const every = Math.max(1, Math.round(data.length / MARKERS_PER_LINE))
  // Markers of the two profiles sit half a step apart so neither hides the other.
  const offset = role === 'baseline' ? Math.floor(every / 2) : 0
  const baseline = role === 'baseline'
  const who = baseline ? (labels.baseline ?? 'Compared profile') : (labels.current ?? 'These settings')
  return {
    label: `${s.name} — ${who}${baseline ? ' (dashed)' : ''}`,
    data,
    borderColor: s.colour,
    backgroundColor: s.colour,
    borderWidth: baseline ? 2 : 2.5,
    borderDash: baseline ? [7, 4] : [],
    pointStyle: baseline ? (s.marker === 'circle' ? 'triangle' : s.marker) : s.marker,
    pointBackgroundColor: baseline ? '#ffffff' : s.colour,
    pointBorderColor: s.colour,
    pointBorderWidth: 1.5,
    pointRadius: (ctx: ScriptableContext<'line'>) => ((ctx.dataIndex - offset) % every === 0 ? (baseline ? 5 : 4) : 0),
    pointHoverRadius: 5,
    tension: 0,
    fill: false
  }
}

export interface ChartConfig { id: string, title: string, xLabel: string, yLabel: string, datasets: LineDataset[], summary: string }

function both(list: SeriesSpec[], baselineList: SeriesSpec[] | null, labels: CurveLabels): LineDataset[] {
  return [...list.map(s => lineDataset(s, 'current', labels)), ...(baselineList ?? []).map(s => lineDataset(s, 'baseline', labels))]
}

const range = (xs: number[], unit: string) => (xs.length ? `from ${Math.round(xs[0]!)} to ${Math.round(xs[xs.length - 1]!)} ${unit}` : 'no data')

export function tuneCharts(c: Curves, base: Curves | undefined, labels: CurveLabels = {}): ChartConfig[] {
  const s = c.speed
  const b = base?.speed
  const t = c.temperature
  const bt = base?.temperature
  const { copper, graphite, blue } = seriesColours
  const sensors = (x: Curves['temperature']): SeriesSpec[] => [
    { name: 'Motor', xs: x.temperatureC, ys: x.motorTorquePct, colour: copper, marker: 'circle' },
    { name: 'Inverter', xs: x.temperatureC, ys: x.inverterTorquePct, colour: graphite, marker: 'rect' },
    { name: 'Battery', xs: x.temperatureC, ys: x.batteryTorquePct, colour: blue, marker: 'rectRot' }
  ]
  return [
    {
      id: 'force', title: 'Wheel force and road load against speed', xLabel: 'Speed (km/h)', yLabel: 'Force (N)',
      // Road load depends on the car alone, so the compared profile adds only its wheel force.
      datasets: both(
        [{ name: 'Wheel force', xs: s.speedKph, ys: s.wheelForceN, colour: copper, marker: 'circle' },
          { name: 'Road load', xs: s.speedKph, ys: s.roadLoadN, colour: graphite, marker: 'rect' }],
        b ? [{ name: 'Wheel force', xs: b.speedKph, ys: b.wheelForceN, colour: copper, marker: 'circle' }] : null, labels),
      summary: `Wheel force and road load in newtons, ${range(s.speedKph, 'km/h')}.`
    },
    {
      id: 'power', title: 'Power at the wheels against speed', xLabel: 'Speed (km/h)', yLabel: 'Power (kW)',
      datasets: both([{ name: 'Power', xs: s.speedKph, ys: s.powerKw, colour: copper, marker: 'circle' }],
        b ? [{ name: 'Power', xs: b.speedKph, ys: b.powerKw, colour: copper, marker: 'circle' }] : null, labels),
      summary: `Power at the wheels in kilowatts, ${range(s.speedKph, 'km/h')}.`
    },
    {
      id: 'regen', title: 'Lift-off regen force against speed', xLabel: 'Speed (km/h)', yLabel: 'Braking force (N)',
      datasets: both([{ name: 'Lift-off regen', xs: s.speedKph, ys: s.liftOffRegenForceN, colour: blue, marker: 'circle' }],
        b ? [{ name: 'Lift-off regen', xs: b.speedKph, ys: b.liftOffRegenForceN, colour: blue, marker: 'circle' }] : null, labels),
      summary: `Braking force at the driven wheels when the accelerator is released, ${range(s.speedKph, 'km/h')}.`
    },
    {
      id: 'derate', title: 'Torque available against temperature', xLabel: 'Temperature (°C)', yLabel: 'Torque available (%)',
      datasets: both(sensors(t), bt ? sensors(bt) : null, labels),
      summary: `Share of torque the controller allows per sensor (motor, inverter, battery), ${range(t.temperatureC, '°C')}.`
    }
  ]
}
