// The shapes an evaluation hands to the editor, the server and the rules.
import type { TopSpeedLimit } from './acceleration'
import type { GradeLimit } from './hill'

export const RULE_IDS = [
  'regen-grip-wet',
  'regen-grip-snow',
  'stop-lamp',
  'power-ratio',
  'tyre-speed',
  'tyre-load',
  'current-limits',
  'hill-start',
  'creep-hold',
  'derate-band'
] as const

export type RuleId = (typeof RULE_IDS)[number]
export type Severity = 'info' | 'caution' | 'danger'

export interface EvaluationError {
  path: string // e.g. "parameters.powerCapKw", "spec.tyreSize"
  message: string
}

export interface Warning {
  rule: RuleId
  severity: Severity
  message: string
  value: number | null // null when the rule could not be checked
  limit: number | null
  unchecked?: true // the controller lacks a setting the rule needs: the road test must cover it
}

// One number setting as a platform's JSON Schema describes it; `unit` and `x-role` are Voltwright's own keywords.
export interface ParameterProperty {
  'type': 'number' | 'integer'
  'title': string
  'description': string
  'unit': string
  'minimum': number
  'maximum': number
  'multipleOf': number
  'default': number
  'x-role'?: string
}

// A switch, a choice or a curve (see docs/computation.md, "Settings").
export interface OtherSettingProperty {
  'type': 'boolean' | 'string' | 'array'
  'title': string
  'description': string
  'default': unknown
  'enum'?: string[]
  'x-enumTitles'?: string[]
  'items'?: Record<string, unknown>
  'minItems'?: number
  'maxItems'?: number
  'x-monotonic'?: boolean
}

export type SettingProperty = ParameterProperty | OtherSettingProperty

export interface PlatformSchema {
  $schema: string
  $id?: string
  title?: string
  description?: string
  type: 'object'
  properties: Record<string, SettingProperty>
  required: string[]
  additionalProperties?: boolean
}

export interface Platform {
  key: string
  name: string
  motorMaxRpm: number
  torqueConstantNmPerA?: number | null
  schema: PlatformSchema
}

// What evaluate accepts: a platform as stored, whose schema may have come from anywhere.
export interface PlatformLike {
  key: string
  name: string
  motorMaxRpm: number
  torqueConstantNmPerA?: number | null // N·m per A, for a unit that caps motor current rather than torque
  schema: unknown
}

export interface AxlePair { front: number | null, rear: number | null }
export interface SurfaceTriple { dry: number | null, wet: number | null, snow: number | null }

export interface Figures {
  testMassKg: number | null
  tyreDiameterMm: number | null // of the driven axle's tyre, which sets the gearing
  rollingRadiusM: number | null
  maxWheelForceN: number | null
  zeroTo50S: number | null
  zeroTo100S: number | null
  topSpeedKph: number | null
  topSpeedLimitedBy: TopSpeedLimit | null
  maxStartGradePct: number | null
  startGradeLimitedBy: GradeLimit | null
  creepHoldGradePct: number | null
  liftOffDecelMs2: number | null
  brakeRegenDecelMs2: number | null
  regenGripLimitMs2: SurfaceTriple
  peakDischargeCurrentA: number | null
  chargeTime10to80H: number | null
  powerRatioToOriginal: number | null
  tyreLoadPerTyreKg: AxlePair
  tyreLoadCapacityKg: AxlePair
  tyreSpeedRatingKph: number | null // the lower of front and rear
}

export type FigureName = keyof Figures
export type NullReasons = Partial<Record<FigureName, string>>

export interface SpeedCurves {
  speedKph: number[]
  wheelForceN: number[]
  powerKw: number[]
  roadLoadN: number[]
  liftOffRegenForceN: number[]
}

export interface TemperatureCurves {
  temperatureC: number[]
  motorTorquePct: number[]
  inverterTorquePct: number[]
  batteryTorquePct: number[]
}

export interface Curves {
  speed: SpeedCurves
  temperature: TemperatureCurves
}

export interface Evaluation {
  valid: boolean
  errors: EvaluationError[]
  warnings: Warning[]
  figures: Figures
  nullReasons: NullReasons
  curves: Curves
  roles?: Partial<Record<string, number | null>> // the role values in their own units (kW, N·m, %, km/h, °C, A); absent in older snapshots
}
