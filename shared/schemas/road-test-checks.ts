// How each mandatory check is driven and what is measured, in the tester's words (common practice).
import type { CheckKey } from './road-test'

export interface CheckField { name: string, label: string, unit: string, step: number, min: number, max: number, required?: boolean }
export interface CheckGuide { key: CheckKey, title: string, short?: string, how: string, fields: CheckField[], feel?: boolean }

export const checkGuides: CheckGuide[] = [
  { key: 'hill-start', title: 'Hill start', how: 'Stop facing up the steepest hill on the route, hold on the brake, release it and pull away. Note the gradient and how far the car rolled back.',
    fields: [{ name: 'gradientPct', label: 'Gradient', unit: '%', step: 0.5, min: 0, max: 60, required: true }, { name: 'rollbackMm', label: 'Roll-back', unit: 'mm', step: 5, min: 0, max: 5000, required: true }] },
  { key: 'lift-off-regen', title: 'Lift-off regen', how: 'At about 50 km/h on a straight, lift right off the accelerator without braking. Feel how strongly it slows and whether the car stays straight.',
    fields: [{ name: 'decelMs2', label: 'Deceleration, if measured', unit: 'm/s²', step: 0.05, min: 0, max: 10 }], feel: true },
  { key: 'brake-regen', title: 'Brake regen', how: 'From about 50 km/h brake gently to a stop. The regen should blend in smoothly with no snatch or pull.',
    fields: [{ name: 'decelMs2', label: 'Deceleration, if measured', unit: 'm/s²', step: 0.05, min: 0, max: 10 }] },
  { key: 'creep', title: 'Creep', how: 'On the level, release the brake with the accelerator up. The car should creep forward gently, and hold on a slight slope.',
    fields: [{ name: 'speedKph', label: 'Creep speed', unit: 'km/h', step: 0.5, min: 0, max: 30 }, { name: 'holdsOnGradientPct', label: 'Holds on a gradient of', unit: '%', step: 0.5, min: 0, max: 60 }] },
  { key: 'full-power', title: 'Full-power pull', short: 'Full power', how: 'Where it is safe and legal, accelerate at full power. Listen and feel for axle tramp, wheelspin, vibration and warning lights.',
    fields: [{ name: 'peakSpeedKph', label: 'Speed reached', unit: 'km/h', step: 1, min: 0, max: 300 }, { name: 'zeroTo50S', label: '0–50 km/h', unit: 's', step: 0.1, min: 0, max: 60 }] },
  { key: 'thermal-soak', title: 'Thermal soak', how: 'After the drive, read the highest motor, inverter and battery temperatures from the controller.',
    fields: [{ name: 'motorC', label: 'Peak motor', unit: '°C', step: 1, min: -40, max: 250, required: true }, { name: 'inverterC', label: 'Peak inverter', unit: '°C', step: 1, min: -40, max: 250, required: true }, { name: 'batteryC', label: 'Peak battery', unit: '°C', step: 1, min: -40, max: 150, required: true }] }
]

// The wizard's step bar names a check by its short name, where the title is too long for a phone's row.
export const stepLabel = (g: CheckGuide) => g.short ?? g.title

export const checkTitles = Object.fromEntries(checkGuides.map(g => [g.key, g.title])) as Record<CheckKey, string>
