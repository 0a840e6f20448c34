import type { H3Event } from 'h3'
import { assertPermission } from '../guards/guards'
import { signedInRead } from '../guards/signed-in'
import { schemaProperties, type SettingValues } from '../../../shared/compute/parameter-input'
import type { Evaluation, PlatformLike } from '../../../shared/compute/types'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import type { VersionState } from '../../../shared/schemas/version'
import type { Op } from 'jsondiffpatch/formatters/jsonpatch'
import { canonicalJson } from '../../../shared/utils/canonical-json'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { settingLabel, settingValueWords } from '../../../shared/utils/setting-words'
import type { ParameterDiffRow, VersionDiff, VersionSide } from '../../../shared/schemas/profile-views'
import { settingsOf, evaluateOnServer } from '../platforms/evaluation'
import { figureDiff, numericChange, warningDiff } from './diff-figures'

interface PairRow {
  id: number, versionNo: number, state: VersionState, parameters: SettingValues, profileName: string,
  vehicleId: number | null, kitId: number | null, spec: VehicleSpec, platformKey: string, platformName: string, motorMaxRpm: number, torqueConstantNmPerA: number | null, schema: unknown, settings: Record<string, unknown>
}

// Both versions with their car, drive unit and workshop settings in one plain query (the diff is on the
// engineer's hot path; nested model includes cost more than the two evaluations), in the same round trip as
// the sign-in check (guards/signed-in.ts); for staff only.
async function loadPair(event: H3Event, aId: number, bId: number) {
  const { user, rows } = await signedInRead<PairRow>(event, u => ({
    sql: `SELECT pv.id, pv."versionNo", pv.state, pv.parameters, p.name AS "profileName", v.id AS "vehicleId", k.id AS "kitId", COALESCE(v.spec, k."specTemplate") AS spec,
            pl.key AS "platformKey", pl.name AS "platformName", pl."motorMaxRpm", pl."torqueConstantNmPerA", pl.schema, w.settings
       FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId" LEFT JOIN vehicles v ON v.id = p."vehicleId" LEFT JOIN kits k ON k.id = p."kitId"
       JOIN platforms pl ON pl.id = COALESCE(v."platformId", k."platformId") JOIN workshops w ON w.id = pv."workshopId"
      WHERE pv.id = ANY(:ids::int[]) AND pv."workshopId" = :workshopId`,
    replacements: { ids: [aId, bId], workshopId: u.workshopId }
  }))
  assertPermission(user, 'staff')
  const pick = (id: number) => {
    const row = rows.find(r => r.id === id)
    if (!row) throw createError({ statusCode: 404, message: 'No such version in this workshop.' })
    return row
  }
  return { a: pick(aId), b: pick(bId), settings: settingsOf({ settings: rows[0]!.settings }) }
}

// Each setting with before and after in words, and for numbers in one unit the change and the change in percent.
export function parameterRows(a: SettingValues, b: SettingValues, schemas: unknown[], aSchema: unknown = schemas[1]): ParameterDiffRow[] {
  const props = schemas.map(s => schemaProperties(s))
  const aProps = schemaProperties(aSchema)
  const names = [...new Set([...props.flatMap(p => Object.keys(p)), ...Object.keys(a), ...Object.keys(b)])]
  return names.map((name) => {
    const prop = props.map(p => p[name]).find(Boolean)
    const before = a[name] ?? null
    const after = b[name] ?? null
    const sameUnit = unitOf(aProps[name] ?? prop) === unitOf(prop)
    const numbers = sameUnit && typeof before === 'number' && typeof after === 'number'
    return {
      name, label: settingLabel(prop, name), unit: numbers || (sameUnit && typeof (before ?? after) === 'number') ? unitOf(prop) : '',
      before, after, beforeText: before === null ? 'not set' : settingValueWords(aProps[name] ?? prop, before), afterText: after === null ? 'not set' : settingValueWords(prop, after),
      ...(numbers ? numericChange(before, after) : { change: null, changePct: null }),
      changed: !sameUnit || canonicalJson(before) !== canonicalJson(after)
    }
  })
}

const unitOf = (p: Record<string, unknown> | undefined) => typeof p?.unit === 'string' ? p.unit : ''

// RFC 6902 from a's settings to b's. A setting whose unit differs between the two drive units is not the
// same quantity: it is removed and added, never replaced, so nobody reads 0.3 (fraction) against 30 (%).
export function settingsPatch(a: SettingValues, b: SettingValues, aSchema: unknown, bSchema: unknown): Op[] {
  const ap = schemaProperties(aSchema)
  const bp = schemaProperties(bSchema)
  const moved = Object.keys(a).filter(n => Object.hasOwn(b, n) && Object.hasOwn(ap, n) && Object.hasOwn(bp, n) && unitOf(ap[n]) !== unitOf(bp[n]))
  const without = (x: SettingValues) => Object.fromEntries(Object.entries(x).filter(([n]) => !moved.includes(n)))
  const path = (n: string) => `/${n.replace(/~/g, '~0').replace(/\//g, '~1')}`
  return [
    ...jsonPatch(without(a), without(b)),
    ...moved.flatMap(n => [{ op: 'remove', path: path(n) }, { op: 'add', path: path(n), value: b[n] }] as Op[])
  ]
}

const platformOf = (r: PairRow): PlatformLike => ({ key: r.platformKey, name: r.platformName, motorMaxRpm: r.motorMaxRpm, torqueConstantNmPerA: r.torqueConstantNmPerA, schema: r.schema })
const head = (r: PairRow) => ({ id: r.id, versionNo: r.versionNo, profileName: r.profileName, state: r.state, vehicleId: r.vehicleId, kitId: r.kitId })
const side = (r: PairRow, e: Evaluation): VersionSide =>
  ({ versionId: r.id, label: `${r.profileName} v${r.versionNo}`, valid: e.valid, errors: e.errors, warnings: e.warnings, figures: e.figures, curves: e.curves })

// What changed from version a to version b, and what that does to the car: both evaluated now, on their cars.
export async function diffVersions(event: H3Event, aId: number, bId: number): Promise<VersionDiff> {
  const { a, b, settings } = await loadPair(event, aId, bId)
  const ea = evaluateOnServer(a.spec, platformOf(a), a.parameters, settings)
  const eb = aId === bId ? ea : evaluateOnServer(b.spec, platformOf(b), b.parameters, settings)
  return {
    a: head(a),
    b: head(b),
    rows: parameterRows(a.parameters, b.parameters, [b.schema, a.schema], a.schema),
    figures: figureDiff(ea.figures, eb.figures),
    warnings: warningDiff(ea.warnings, eb.warnings),
    patch: settingsPatch(a.parameters, b.parameters, a.schema, b.schema),
    evaluations: { a: side(a, ea), b: side(b, eb) }
  }
}
