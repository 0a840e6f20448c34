import type { Figures } from '../compute/types'

// The figures (docs/computation.md#figures) as the compare screen lists them; axle and surface pairs are one row each.
export const FIGURE_ROWS: { name: string, label: string, unit: string, read: (f: Figures) => number | string | null }[] = [
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
