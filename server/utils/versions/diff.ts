import type { SignedIn } from '../guards/guards'
import { PARAMETER_NAMES } from '../../../shared/compute/parameters'
import { schemaProperties } from '../../../shared/compute/parameter-input'
import type { Evaluation, PlatformLike } from '../../../shared/compute/types'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import type { VersionState } from '../../../shared/schemas/version'
import { jsonPatch } from '../../../shared/utils/json-patch'
import type { ParameterDiffRow, VersionDiff, VersionSide } from '../../../shared/schemas/profile-views'
import { selectRows } from '../database/db'
import { settingsOf, evaluateOnServer } from '../platforms/evaluation'
import { figureDiff, warningDiff } from './diff-figures'

interface PairRow {
  id: number, versionNo: number, state: VersionState, parameters: Record<string, number>, profileName: string,
  vehicleId: number, spec: VehicleSpec, platformKey: string, platformName: string, motorMaxRpm: number, schema: unknown, settings: Record<string, unknown>
}

// Both versions with their car, drive unit and workshop settings in one plain query (the diff is on the
// engineer's hot path; nested model includes cost more than the two evaluations).
async function loadPair(user: SignedIn, aId: number, bId: number) {
  const rows = await selectRows<PairRow>(
    `SELECT pv.id, pv."versionNo", pv.state, pv.parameters, p.name AS "profileName", v.id AS "vehicleId", v.spec,
            pl.key AS "platformKey", pl.name AS "platformName", pl."motorMaxRpm", pl.schema, w.settings
       FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId" JOIN vehicles v ON v.id = p."vehicleId"
       JOIN platforms pl ON pl.id = v."platformId" JOIN workshops w ON w.id = pv."workshopId"
      WHERE pv.id = ANY(:ids::int[]) AND pv."workshopId" = :workshopId`, { ids: [aId, bId], workshopId: user.workshopId })
  const pick = (id: number) => {
    const row = rows.find(r => r.id === id)
    if (!row) throw createError({ statusCode: 404, message: 'No such version in this workshop.' })
    return row
  }
  return { a: pick(aId), b: pick(bId), settings: settingsOf({ settings: rows[0]!.settings }) }
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

const platformOf = (r: PairRow): PlatformLike => ({ key: r.platformKey, name: r.platformName, motorMaxRpm: r.motorMaxRpm, schema: r.schema })
const head = (r: PairRow) => ({ id: r.id, versionNo: r.versionNo, profileName: r.profileName, state: r.state, vehicleId: r.vehicleId })
const side = (r: PairRow, e: Evaluation): VersionSide =>
  ({ versionId: r.id, label: `${r.profileName} v${r.versionNo}`, valid: e.valid, errors: e.errors, warnings: e.warnings, figures: e.figures, curves: e.curves })

// What changed from version a to version b, and what that does to the car: both evaluated now, on their cars.
export async function diffVersions(user: SignedIn, aId: number, bId: number): Promise<VersionDiff> {
  const { a, b, settings } = await loadPair(user, aId, bId)
  const ea = evaluateOnServer(a.spec, platformOf(a), a.parameters, settings)
  const eb = aId === bId ? ea : evaluateOnServer(b.spec, platformOf(b), b.parameters, settings)
  return {
    a: head(a),
    b: head(b),
    rows: parameterRows(a.parameters, b.parameters, [b.schema, a.schema]),
    figures: figureDiff(ea.figures, eb.figures),
    warnings: warningDiff(ea.warnings, eb.warnings),
    patch: jsonPatch(a.parameters, b.parameters),
    evaluations: { a: side(a, ea), b: side(b, eb) }
  }
}
