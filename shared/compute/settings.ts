// A workshop's thresholds for the safety rules, with the defaults a new workshop starts from.
import { z } from 'zod'

// Each number setting's name and allowed range; the messages name the setting, so the API's answer and the
// admin's form read the same. `share` settings are fractions (0-1) that the form shows as percentages.
export const settingLimits = {
  'friction.dry': { name: 'Dry-road friction', min: 0.3, max: 1.2, unit: '' },
  'friction.wet': { name: 'Wet-road friction', min: 0.1, max: 1, unit: '' },
  'friction.snow': { name: 'Snow friction', min: 0.05, max: 0.5, unit: '' },
  'minStartGradePct': { name: 'Minimum hill-start gradient', min: 0, max: 60, unit: ' %' },
  'minCreepHoldGradePct': { name: 'Minimum creep-hold gradient', min: 0, max: 30, unit: ' %' },
  'powerRatio.caution': { name: 'Power ratio for a caution', min: 1, max: 10, unit: ' times' },
  'powerRatio.danger': { name: 'Power ratio for a danger warning', min: 1, max: 20, unit: ' times' },
  'minDerateBandC': { name: 'Minimum derate band', min: 0, max: 60, unit: ' °C' },
  'regenGripCautionFraction': { name: 'Regen grip caution share', min: 0, max: 1, unit: '', share: true },
  'tyreLoadCautionFraction': { name: 'Tyre load caution share', min: 0, max: 1, unit: '', share: true }
} as const

export type NumberSetting = keyof typeof settingLimits

function limited(path: NumberSetting, fallback: number) {
  const l = settingLimits[path]
  const number = z.number({ error: `${l.name} needs a number` })
  if ('share' in l) {
    const message = `${l.name} must be above 0 % and below 100 % (a fraction between ${l.min} and ${l.max})`
    return number.gt(l.min, message).lt(l.max, message).default(fallback)
  }
  const message = `${l.name} must be from ${l.min} to ${l.max}${l.unit}`
  return number.min(l.min, message).max(l.max, message).default(fallback)
}

export const workshopSettingsSchema = z.object({
  // Tyre-road friction per surface, within handbook ranges (Bosch Automotive Handbook; Noon 1994).
  friction: z.object({
    dry: limited('friction.dry', 0.8),
    wet: limited('friction.wet', 0.5),
    snow: limited('friction.snow', 0.2)
  }).prefault({}).refine(f => f.snow <= f.wet && f.wet <= f.dry, { message: 'Friction must not rise from dry to wet to snow' }),
  minStartGradePct: limited('minStartGradePct', 20), // UN R13-H parking-brake gradient
  minCreepHoldGradePct: limited('minCreepHoldGradePct', 5),
  powerRatio: z.object({
    caution: limited('powerRatio.caution', 1.5),
    danger: limited('powerRatio.danger', 2.5)
  }).prefault({}).refine(p => p.caution < p.danger, { message: 'The caution ratio must be below the danger ratio' }),
  minDerateBandC: limited('minDerateBandC', 10),
  regenGripCautionFraction: limited('regenGripCautionFraction', 0.8), // caution once lift-off regen uses this share of the grip
  tyreLoadCautionFraction: limited('tyreLoadCautionFraction', 0.9), // caution once a tyre carries this share of its rating
  units: z.object({
    power: z.enum(['kW+hp', 'kW']).default('kW+hp'),
    speed: z.enum(['km/h', 'mph']).default('km/h')
  }).prefault({})
})

export type WorkshopSettings = z.output<typeof workshopSettingsSchema>
export type WorkshopSettingsInput = z.input<typeof workshopSettingsSchema>

export const defaultSettings: WorkshopSettings = workshopSettingsSchema.parse({})

export type Surface = keyof WorkshopSettings['friction']
