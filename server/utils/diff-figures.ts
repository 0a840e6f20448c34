import type { Figures, Warning } from '../../shared/compute/types'
import type { FigureDiffRow, WarningDiff } from '../../shared/schemas/profile-views'

// The figures of DESIGN §4 as the compare screen lists them; axle and surface pairs are one row each.
const FIGURES: { name: string, label: string, unit: string, read: (f: Figures) => number | string | null }[] = [
  { name: 'zeroTo50S', label: '0–50 km/h', unit: 's', read: f => f.zeroTo50S },
  { name: 'zeroTo100S', label: '0–100 km/h', unit: 's', read: f => f.zeroTo100S },
  { name: 'topSpeedKph', label: 'Top speed', unit: 'km/h', read: f => f.topSpeedKph },
  { name: 'topSpeedLimitedBy', label: 'Top speed limited by', unit: '', read: f => f.topSpeedLimitedBy },
  { name: 'maxWheelForceN', label: 'Most pull at the wheels', unit: 'N', read: f => f.maxWheelForceN },
  { name: 'powerRatioToOriginal', label: 'Power against the original engine', unit: '×', read: f => f.powerRatioToOriginal },
  { name: 'maxStartGradePct', label: 'Steepest hill start', unit: '%', read: f => f.maxStartGradePct },
  { name: 'startGradeLimitedBy', label: 'Hill start limited by', unit: '', read: f => f.startGradeLimitedBy },
  { name: 'creepHoldGradePct', label: 'Creep holds the car on', unit: '%', read: f => f.creepHoldGradePct },
  { name: 'liftOffDecelMs2', label: 'Lift-off deceleration at 50 km/h', unit: 'm/s²', read: f => f.liftOffDecelMs2 },
  { name: 'brakeRegenDecelMs2', label: 'Brake regen deceleration at 50 km/h', unit: 'm/s²', read: f => f.brakeRegenDecelMs2 },
  { name: 'regenGripLimitMs2.dry', label: 'Driven-axle grip limit, dry', unit: 'm/s²', read: f => f.regenGripLimitMs2.dry },
  { name: 'regenGripLimitMs2.wet', label: 'Driven-axle grip limit, wet', unit: 'm/s²', read: f => f.regenGripLimitMs2.wet },
  { name: 'regenGripLimitMs2.snow', label: 'Driven-axle grip limit, snow', unit: 'm/s²', read: f => f.regenGripLimitMs2.snow },
  { name: 'peakDischargeCurrentA', label: 'Battery current at the power cap', unit: 'A', read: f => f.peakDischargeCurrentA },
  { name: 'chargeTime10to80H', label: 'Charge 10 → 80 %', unit: 'h', read: f => f.chargeTime10to80H },
  { name: 'tyreLoadPerTyreKg.front', label: 'Load per front tyre', unit: 'kg', read: f => f.tyreLoadPerTyreKg.front },
  { name: 'tyreLoadPerTyreKg.rear', label: 'Load per rear tyre', unit: 'kg', read: f => f.tyreLoadPerTyreKg.rear },
  { name: 'tyreLoadCapacityKg.front', label: 'Front tyre load rating', unit: 'kg', read: f => f.tyreLoadCapacityKg.front },
  { name: 'tyreLoadCapacityKg.rear', label: 'Rear tyre load rating', unit: 'kg', read: f => f.tyreLoadCapacityKg.rear },
  { name: 'tyreSpeedRatingKph', label: 'Tyre speed rating', unit: 'km/h', read: f => f.tyreSpeedRatingKph },
  { name: 'testMassKg', label: 'Test mass (kerb + payload)', unit: 'kg', read: f => f.testMassKg },
  { name: 'tyreDiameterMm', label: 'Driven tyre diameter', unit: 'mm', read: f => f.tyreDiameterMm },
  { name: 'rollingRadiusM', label: 'Rolling radius', unit: 'm', read: f => f.rollingRadiusM }
]

// Twelve significant figures: enough for any workshop figure, and 0.1 + 0.2 reads as 0.3.
const tidy = (x: number) => Number(x.toPrecision(12))

export function numericChange(before: unknown, after: unknown): { change: number | null, changePct: number | null } {
  if (typeof before !== 'number' || typeof after !== 'number') return { change: null, changePct: null }
  const change = tidy(after - before)
  return { change, changePct: before === 0 ? null : tidy((change / Math.abs(before)) * 100) }
}

function same(a: number | string | null, b: number | string | null) {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))
  return a === b
}

export function figureDiff(a: Figures, b: Figures): FigureDiffRow[] {
  return FIGURES.map(({ name, label, unit, read }) => {
    const before = read(a)
    const after = read(b)
    return { name, label, unit, before, after, ...numericChange(before, after), changed: !same(before, after) }
  })
}

// A rule can warn more than once (lift-off and brake regen); the wording without its numbers tells them apart.
const gist = (w: Warning) => `${w.rule}|${w.message.replace(/[\d.,]+/g, '#')}`

// The warnings that came, those that went, and those on both sides (perhaps at another severity or value):
// first matched by rule and wording, then what is left of the same rule in order.
export function warningDiff(a: Warning[], b: Warning[]): WarningDiff {
  const left = [...a]
  const kept: WarningDiff['kept'] = []
  const appeared: Warning[] = []
  const unmatched: Warning[] = []
  for (const w of b) {
    const i = left.findIndex(x => gist(x) === gist(w))
    if (i >= 0) kept.push({ before: left.splice(i, 1)[0]!, after: w })
    else unmatched.push(w)
  }
  for (const w of unmatched) {
    const i = left.findIndex(x => x.rule === w.rule)
    if (i >= 0) kept.push({ before: left.splice(i, 1)[0]!, after: w })
    else appeared.push(w)
  }
  return { appeared, disappeared: left, kept }
}
