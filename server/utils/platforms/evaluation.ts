import type { ErrorObject } from 'ajv'
import { evaluate, workshopSettingsSchema, defaultSettings, type Evaluation, type EvaluationError, type PlatformLike, type WorkshopSettings } from '../../../shared/compute'
import { compileParameterValidator } from '../../../shared/platforms/ajv'
import { unknownSettings } from '../../../shared/platforms/keywords'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { Workshop } from '../../models'

// A workshop's rule thresholds; settings that no longer parse fall back to the defaults rather than fail.
export function settingsOf(workshop: { settings?: unknown } | null | undefined): WorkshopSettings {
  const parsed = workshopSettingsSchema.safeParse(workshop?.settings ?? {})
  return parsed.success ? parsed.data : defaultSettings
}

export async function loadWorkshopSettings(workshopId: number): Promise<WorkshopSettings> {
  return settingsOf(await Workshop.findByPk(workshopId, { attributes: ['settings'] }))
}

function ajvPath(e: ErrorObject): string {
  const name = (e.params as { missingProperty?: string, additionalProperty?: string }).missingProperty
    ?? (e.params as { additionalProperty?: string }).additionalProperty
    ?? e.instancePath.replace(/^\//, '').replace(/\//g, '.')
  return name ? `parameters.${name}` : 'parameters'
}

// The server's evaluation: the shared computation, plus the platform's JSON Schema checked by ajv
// (compiled once per platform). A field evaluate already flagged is not reported twice. Settings the schema does
// not define (in data stored before they were refused) are reported as errors and never reach ajv.
export function evaluateOnServer(spec: VehicleSpec, platform: PlatformLike, parameters: Record<string, unknown>, settings: WorkshopSettings): Evaluation {
  const result = evaluate(spec, platform, parameters, settings)
  const unknown = unknownSettings(platform.schema, Object.keys(parameters))
  if (unknown.length) {
    const seen = new Set(result.errors.map(e => e.path))
    const extra = unknown.map(n => ({ path: `parameters.${n}`, message: `Not a setting of the ${platform.name}` })).filter(e => !seen.has(e.path))
    return { ...result, valid: false, errors: [...result.errors, ...extra] }
  }
  const validate = compileParameterValidator(platform)
  if (!validate) {
    const error = { path: 'platform.schema', message: `The ${platform.name}'s schema uses keywords Voltwright no longer accepts; the workshop manager should upload it again` }
    return { ...result, valid: false, errors: [...result.errors, error] }
  }
  if (!validate(parameters)) {
    const seen = new Set(result.errors.map(e => e.path))
    const extra: EvaluationError[] = []
    for (const e of validate.errors ?? []) {
      const path = ajvPath(e)
      if (seen.has(path)) continue
      seen.add(path)
      extra.push({ path, message: e.message ?? 'is not valid' })
    }
    if (extra.length) return { ...result, valid: false, errors: [...result.errors, ...extra] }
  }
  return result
}
