import { z } from 'zod'
import { justificationsSchema, parametersSchema } from './profile'
import { checkTitles } from './road-test-checks'

// A road test (docs/architecture.md#road-test): conditions, one verdict per mandatory check with its measured values.
export const surfaces = ['dry', 'wet', 'snow'] as const
export const checkVerdicts = ['pass', 'fail', 'not-tested'] as const
export const roadTestVerdicts = ['pass', 'fail'] as const
export const mandatoryCheckKeys = ['hill-start', 'lift-off-regen', 'brake-regen', 'creep', 'full-power', 'thermal-soak'] as const
export type CheckKey = typeof mandatoryCheckKeys[number]
export type CheckVerdict = typeof checkVerdicts[number]

export const surfaceLabels: Record<typeof surfaces[number], string> = { dry: 'Dry', wet: 'Wet', snow: 'Snow or ice' }
export const checkVerdictLabels: Record<CheckVerdict, string> = { 'pass': 'Pass', 'fail': 'Fail', 'not-tested': 'Not tested' }

const num = (label: string, min: number, max: number) =>
  z.number({ error: `${label} is needed` }).min(min, `${label}: at least ${min}`).max(max, `${label}: at most ${max}`)
const optionalNum = (label: string, min: number, max: number) => num(label, min, max).nullable().optional()

// Each check's measured values; a value the check needs is required unless the check was not tested.
const valueShapes = {
  'hill-start': z.object({ gradientPct: optionalNum('Gradient', 0, 60), rollbackMm: optionalNum('Roll-back', 0, 5000) }).strict(),
  'lift-off-regen': z.object({ decelMs2: optionalNum('Deceleration', 0, 10), feel: z.enum(['gentle', 'firm', 'harsh']).nullable().optional() }).strict(),
  'brake-regen': z.object({ decelMs2: optionalNum('Deceleration', 0, 10) }).strict(),
  'creep': z.object({ speedKph: optionalNum('Creep speed', 0, 30), holdsOnGradientPct: optionalNum('Holds on gradient', 0, 60) }).strict(),
  'full-power': z.object({ peakSpeedKph: optionalNum('Peak speed', 0, 300), zeroTo50S: optionalNum('0-50 km/h', 0, 60) }).strict(),
  'thermal-soak': z.object({ motorC: optionalNum('Peak motor temperature', -40, 250), inverterC: optionalNum('Peak inverter temperature', -40, 250), batteryC: optionalNum('Peak battery temperature', -40, 150) }).strict()
} satisfies Record<CheckKey, z.ZodType>

export const requiredValues: Record<CheckKey, string[]> = {
  'hill-start': ['gradientPct', 'rollbackMm'],
  'lift-off-regen': [],
  'brake-regen': [],
  'creep': [],
  'full-power': [],
  'thermal-soak': ['motorC', 'inverterC', 'batteryC']
}

const checkOf = <K extends CheckKey, V extends z.ZodType>(key: K, values: V) => z.object({
  key: z.literal(key),
  verdict: z.enum(checkVerdicts, { error: 'Choose pass, fail or not tested' }),
  values,
  note: z.string().trim().max(2000).default('')
}).strict()

export const roadTestCheckSchema = z.discriminatedUnion('key', [
  checkOf('hill-start', valueShapes['hill-start'].default({})),
  checkOf('lift-off-regen', valueShapes['lift-off-regen'].default({})),
  checkOf('brake-regen', valueShapes['brake-regen'].default({})),
  checkOf('creep', valueShapes.creep.default({})),
  checkOf('full-power', valueShapes['full-power'].default({})),
  checkOf('thermal-soak', valueShapes['thermal-soak'].default({}))
])
export type RoadTestCheckInput = z.output<typeof roadTestCheckSchema>

// One of the workshop's own checks in a road test's body, beside the six (docs/road-tests.md).
export const extraCheckResultSchema = z.object({
  key: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Not a check of this workshop').max(60)
    .refine(k => !(mandatoryCheckKeys as readonly string[]).includes(k), 'Not a check of this workshop'),
  verdict: z.enum(checkVerdicts, { error: 'Choose pass, fail or not tested' }),
  values: z.object({ value: z.number().finite().min(-1e6).max(1e6).nullable().optional() }).strict().default({}),
  note: z.string().trim().max(2000).default('')
}).strict()
export type ExtraCheckResult = z.output<typeof extraCheckResultSchema>

const isMandatory = (c: { key: string }): c is RoadTestCheckInput => (mandatoryCheckKeys as readonly string[]).includes(c.key)

export const conditionsSchema = z.object({
  surface: z.enum(surfaces, { error: 'Choose dry, wet or snow' }),
  ambientC: num('Ambient temperature', -40, 55),
  route: z.string().trim().max(500).default('')
}).strict()

export const roadTestCreateSchema = z.object({
  conditions: conditionsSchema,
  checks: z.array(z.union([roadTestCheckSchema, extraCheckResultSchema], { error: 'Not a check of this road test' })).max(72),
  verdict: z.enum(roadTestVerdicts, { error: 'Choose pass or fail' }),
  // The tester's tick before setting off (docs/road-tests.md#before-you-set-off); the record keeps it in words.
  preDriveConfirmed: z.literal(true, { error: 'Read the cautions and tick that the car is ready before you set off' }),
  testedAt: z.coerce.date().optional(),
  // Given by the phone when the record is begun, so a send repeated after a lost answer records it once.
  idempotencyKey: z.uuid({ error: 'A send key as the phone makes it' }).optional()
}).strict().superRefine((rt, ctx) => {
  for (const key of mandatoryCheckKeys) {
    const found = rt.checks.filter(c => c.key === key)
    // Said by the check's name as the tester knows it ("hill start"), never its key.
    const name = checkTitles[key].toLowerCase()
    if (found.length === 0) ctx.addIssue({ code: 'custom', path: ['checks'], message: `The ${name} check is missing` })
    if (found.length > 1) ctx.addIssue({ code: 'custom', path: ['checks'], message: `The ${name} check is there twice` })
  }
  const keys = rt.checks.map(c => c.key)
  keys.forEach((k, i) => {
    if (keys.indexOf(k) !== i && !isMandatory({ key: k })) ctx.addIssue({ code: 'custom', path: ['checks', i], message: 'This check is there twice' })
  })
  rt.checks.forEach((c, i) => {
    if (c.verdict === 'not-tested' || !isMandatory(c)) return
    for (const v of requiredValues[c.key]) {
      const value = (c.values as Record<string, unknown>)[v]
      if (value === undefined || value === null) ctx.addIssue({ code: 'custom', path: ['checks', i, 'values', v], message: 'Measured value needed' })
    }
  })
  if (rt.verdict === 'pass' && rt.checks.some(c => c.verdict === 'fail')) {
    ctx.addIssue({ code: 'custom', path: ['verdict'], message: 'A road test with a failed check cannot pass' })
  }
})
export type RoadTestCreate = z.output<typeof roadTestCreateSchema>

// A roadside change is sent for review at once, so it carries the submit's justifications.
export const roadsideVersionSchema = z.object({
  parameters: parametersSchema,
  rationale: z.string().trim().min(1, 'Say what you changed at the roadside and why').max(4000),
  justifications: justificationsSchema
}).strict()
export type RoadsideVersionInput = z.output<typeof roadsideVersionSchema>
