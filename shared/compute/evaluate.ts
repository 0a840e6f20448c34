// One evaluation of a profile on a car: hard errors, safety warnings, figures and chart curves.
import type { VehicleSpec } from '../schemas/vehicle-spec'
import { carModel } from './car-model'
import { emptySpeedCurves, speedCurves, temperatureCurves } from './curves'
import { computeFigures } from './figures'
import { scrubFigures } from './finite'
import { derateOrderErrors, readParameters } from './parameter-input'
import { roleSettings, roleValues, ROLES, type Role } from './roles'
import { runRules } from './rules/index'
import { defaultSettings, workshopSettingsSchema, type WorkshopSettings, type WorkshopSettingsInput } from './settings'
import { readSpec } from './spec-input'
import { readTyres } from './tyre-input'
import { overallDiameterMm, rollingRadiusM } from './tyres'
import type { Evaluation, EvaluationError, PlatformLike } from './types'

export function evaluate(spec: VehicleSpec, platform: PlatformLike, parameters: Record<string, unknown>, settings?: WorkshopSettingsInput): Evaluation {
  const s = readSettings(settings)
  const read = readSpec(spec)
  const tyres = readTyres(read.spec)
  const params = readParameters(platform, parameters)
  const roles = roleValues(platform?.schema, params.values, { torqueConstantNmPerA: platform?.torqueConstantNmPerA })
  const values = roles.values
  const motorMaxRpm = readMotorMaxRpm(platform)
  const errors = [...s.errors, ...read.errors, ...tyres.errors, ...motorMaxRpm.errors, ...params.errors, ...roles.problems,
    ...derateOrderErrors(values, roleSettingNames(platform?.schema))]
  const inputs = { spec: read.spec, parameters: values, missing: roles.missing, motorMaxRpm: motorMaxRpm.value, settings: s.settings, tyres: tyres.tyres }
  const { figures, nullReasons } = computeFigures(inputs)
  scrubFigures(figures, nullReasons)
  const warnings = runRules({ figures, parameters: values, missing: roles.missing, spec: read.spec, settings: s.settings })
  const driven = tyres.tyres.driven
  const car = driven ? carModel(read.spec, values, motorMaxRpm.value, rollingRadiusM(overallDiameterMm(driven)), s.settings) : null
  const speed = car ? speedCurves(car, read.spec, values) : emptySpeedCurves()
  return {
    valid: errors.length === 0,
    errors,
    warnings,
    figures,
    nullReasons,
    roles: values,
    curves: { speed, temperature: temperatureCurves(values) }
  }
}

// Settings stored by a workshop may be partial or stale: fill from the defaults, and say what was wrong.
function readSettings(input: unknown): { settings: WorkshopSettings, errors: EvaluationError[] } {
  if (input === undefined) return { settings: defaultSettings, errors: [] }
  const parsed = workshopSettingsSchema.safeParse(input)
  if (parsed.success) return { settings: parsed.data, errors: [] }
  const errors = parsed.error.issues.map(i => ({ path: ['settings', ...i.path.map(String)].join('.'), message: i.message }))
  return { settings: defaultSettings, errors }
}

// Without a usable motorMaxRpm the rpm cut-off is left out rather than guessed.
function readMotorMaxRpm(platform: PlatformLike): { value: number, errors: EvaluationError[] } {
  const rpm = platform?.motorMaxRpm
  if (typeof rpm === 'number' && Number.isFinite(rpm) && rpm > 0) return { value: rpm, errors: [] }
  return { value: Number.POSITIVE_INFINITY, errors: [{ path: 'platform.motorMaxRpm', message: `The ${platform?.name ?? 'platform'} needs a motor speed limit above 0 rpm` }] }
}

// Role value name → the schema's setting name, so an error points at the setting the tuner sees.
function roleSettingNames(schema: unknown): Record<string, string> {
  return Object.fromEntries(Object.entries(roleSettings(schema)).map(([role, name]) => [ROLES[role as Role].field, name]))
}
