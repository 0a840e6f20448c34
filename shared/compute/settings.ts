// A workshop's thresholds for the safety rules, with the defaults a new workshop starts from.
import { z } from 'zod'

const fraction = z.number().gt(0).lt(1)

export const workshopSettingsSchema = z.object({
  // Tyre-road friction per surface, within handbook ranges (Bosch Automotive Handbook; Noon 1994).
  friction: z.object({
    dry: z.number().min(0.3).max(1.2).default(0.8),
    wet: z.number().min(0.1).max(1).default(0.5),
    snow: z.number().min(0.05).max(0.5).default(0.2)
  }).prefault({}).refine(f => f.snow <= f.wet && f.wet <= f.dry, { message: 'Friction must not rise from dry to wet to snow' }),
  minStartGradePct: z.number().min(0).max(60).default(20), // UN R13-H parking-brake gradient
  minCreepHoldGradePct: z.number().min(0).max(30).default(5),
  powerRatio: z.object({
    caution: z.number().min(1).max(10).default(1.5),
    danger: z.number().min(1).max(20).default(2.5)
  }).prefault({}).refine(p => p.caution < p.danger, { message: 'The caution ratio must be below the danger ratio' }),
  minDerateBandC: z.number().min(0).max(60).default(10),
  regenGripCautionFraction: fraction.default(0.8), // caution once lift-off regen uses this share of the grip
  tyreLoadCautionFraction: fraction.default(0.9), // caution once a tyre carries this share of its rating
  units: z.object({
    power: z.enum(['kW+hp', 'kW']).default('kW+hp'),
    speed: z.enum(['km/h', 'mph']).default('km/h')
  }).prefault({})
})

export type WorkshopSettings = z.output<typeof workshopSettingsSchema>
export type WorkshopSettingsInput = z.input<typeof workshopSettingsSchema>

export const defaultSettings: WorkshopSettings = workshopSettingsSchema.parse({})

export type Surface = keyof WorkshopSettings['friction']
