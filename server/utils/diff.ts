import { Platform, Profile, ProfileVersion, Vehicle } from '../models'
import type { SignedIn } from './guards'
import { PARAMETER_NAMES } from '../../shared/compute/parameters'
import { schemaProperties } from '../../shared/compute/parameter-input'
import type { Evaluation } from '../../shared/compute/types'
import { jsonPatch } from '../../shared/utils/json-patch'
import type { ParameterDiffRow, VersionDiff, VersionSide } from '../../shared/schemas/profile-views'

async function loadPair(user: SignedIn, aId: number, bId: number) {
  const versions = await ProfileVersion.findAll({ where: { id: [aId, bId], workshopId: user.workshopId } })
  const a = versions.find(v => v.id === aId)
  const b = versions.find(v => v.id === bId)
  if (!a || !b) throw createError({ statusCode: 404, message: 'No such version in this workshop.' })
  const profiles = await Profile.findAll({
    where: { id: [...new Set([a.profileId, b.profileId])] },
    include: [{ model: Vehicle, as: 'vehicle', include: [{ model: Platform, as: 'platform' }] }]
  })
  const contextOf = (v: ProfileVersion) => {
    const profile = profiles.find(p => p.id === v.profileId)! as Profile & { vehicle: Vehicle }
    return { version: v, profile, vehicle: profile.vehicle, platform: profile.vehicle.platform! }
  }
  return { a: contextOf(a), b: contextOf(b) }
}

// Each setting with before, after, the change and the change in percent, in the unit of the platform's schema.
export function parameterRows(a: Record<string, number>, b: Record<string, number>, schemas: unknown[]): ParameterDiffRow[] {
  const props = schemas.map(s => schemaProperties(s))
  const names = [...new Set([...PARAMETER_NAMES, ...props.flatMap(p => Object.keys(p)), ...Object.keys(a), ...Object.keys(b)])]
  return names.map((name) => {
    const prop = props.map(p => p[name]).find(Boolean)
    const before = typeof a[name] === 'number' ? a[name] : null
    const after = typeof b[name] === 'number' ? b[name] : null
    return { name, label: typeof prop?.title === 'string' ? prop.title : name, unit: typeof prop?.unit === 'string' ? prop.unit : '', before, after, ...numericChange(before, after), changed: before !== after }
  })
}

function side(versionId: number, label: string, e: Evaluation): VersionSide {
  return { versionId, label, valid: e.valid, errors: e.errors, warnings: e.warnings, figures: e.figures, curves: e.curves }
}

// What changed from version a to version b, and what that does to the car: both evaluated now, on their cars.
export async function diffVersions(user: SignedIn, aId: number, bId: number): Promise<VersionDiff> {
  const [{ a, b }, settings] = await Promise.all([loadPair(user, aId, bId), loadWorkshopSettings(user.workshopId)])
  const ea = evaluateOnServer(a.vehicle.spec, a.platform, a.version.parameters, settings)
  const eb = a === b ? ea : evaluateOnServer(b.vehicle.spec, b.platform, b.version.parameters, settings)
  const head = (c: typeof a) => ({ id: c.version.id, versionNo: c.version.versionNo, profileName: c.profile.name, state: c.version.state, vehicleId: c.vehicle.id })
  const label = (c: typeof a) => `${c.profile.name} v${c.version.versionNo}`
  return {
    a: head(a),
    b: head(b),
    rows: parameterRows(a.version.parameters, b.version.parameters, [b.platform.schema, a.platform.schema]),
    figures: figureDiff(ea.figures, eb.figures),
    warnings: warningDiff(ea.warnings, eb.warnings),
    patch: jsonPatch(a.version.parameters, b.version.parameters),
    evaluations: { a: side(a.version.id, label(a), ea), b: side(b.version.id, label(b), eb) }
  }
}
