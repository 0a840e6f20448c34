// The fields a history change names, in the workshop's words: "/spec/kerbMassKg" on a car is
// "Kerb mass (converted), kg". Paths with no words of their own keep their names, joined by ›.
import { schemaProperties } from '../compute/parameter-input'
import { curveAxes } from '../compute/setting-kinds'
import { settingLimits } from '../compute/settings'
import { platforms } from '../platforms'
import { specGroups } from '../schemas/vehicle-spec-fields'

const withUnit = (label: string, unit?: string) => (unit && !/^[:0×]/.test(unit) ? `${label}, ${unit}` : label)

const carLabels: Record<string, string> = {
  '/stockRef': 'Stock ref', '/make': 'Make', '/model': 'Model', '/year': 'Year', '/chassisNumber': 'Chassis number',
  '/registration': 'Registration', '/status': 'Stage', '/ownerUserId': 'Owner (person no.)', '/platformKey': 'Drive unit',
  '/driftedAt': 'Drift found at',
  ...Object.fromEntries(specGroups.flatMap(g => g.fields).map(f => [`/spec/${f.key}`, withUnit(f.label, f.unit)]))
}

// Voltwright's own drive units share their settings' titles; a workshop's own unit may add others.
const parameterTitles = Object.fromEntries(platforms.flatMap(p => Object.entries(schemaProperties(p.schema)))
  .map(([name, prop]) => [`/parameters/${name}`, withUnit(String(prop.title ?? name), typeof prop.unit === 'string' ? prop.unit : undefined)]))
const versionLabels: Record<string, string> = { ...parameterTitles, '/rationale': 'Rationale', '/parameters': 'Settings' }

const settingLabels: Record<string, string> = {
  ...Object.fromEntries(Object.entries(settingLimits).map(([path, l]) => [`/${path.replace('.', '/')}`, l.name])),
  '/units/power': 'Power shown as', '/units/speed': 'Speed shown as'
}

const snagLabels: Record<string, string> = {
  '/title': 'Snag', '/kind': 'Kind', '/priority': 'Priority', '/status': 'Status', '/blocking': 'Blocks sign-off', '/assigneeId': 'Assigned to', '/detail': 'Detail'
}

const userLabels: Record<string, string> = { '/name': 'Name', '/email': 'E-mail', '/roles': 'Roles', '/active': 'Can sign in' }
const platformLabels: Record<string, string> = { '/name': 'Name', '/key': 'Short name', '/motorMaxRpm': 'Highest motor speed, rpm' }

const checkLabels: Record<string, string> = {
  '/label': 'Check', '/record': 'Recorded as', '/min': 'Lowest allowed', '/max': 'Highest allowed', '/unit': 'Unit',
  '/required': 'Required on every road test', '/platformKeys': 'For drive units', '/retired': 'Retired', '/key': 'Short name'
}

// A conversion kit: its drive unit, the cars it fits and the typical car its baseline is checked on.
const kitLabels: Record<string, string> = {
  '/name': 'Name', '/platformKey': 'Drive unit', '/fits': 'Fits',
  ...Object.fromEntries(specGroups.flatMap(g => g.fields).map(f => [`/specTemplate/${f.key}`, `Typical car: ${withUnit(f.label, f.unit).replace(/^./, c => c.toLowerCase())}`]))
}

// A read-back that differs marks the car as drifted.
const readbackLabels: Record<string, string> = { '/driftedAt': 'Car marked as drifted' }

const byEntity: Record<string, Record<string, string>> = { 'kit': kitLabels, 'readback': readbackLabels, 'vehicle': carLabels, 'version': versionLabels, 'workshop': settingLabels, 'snag': snagLabels, 'user': userLabels, 'platform': platformLabels, 'workshop-check': checkLabels }

// A curve's point of a version's setting: "/parameters/throttleMap/2/y" is "Throttle map, point 3, torque".
const curveProps = Object.fromEntries(platforms.flatMap(p => Object.entries(schemaProperties(p.schema))).filter(([, p]) => p.type === 'array'))

function pointLabel(path: string): string | undefined {
  const m = /^\/parameters\/([^/]+)\/(\d+)(?:\/([xy]))?$/.exec(path)
  const prop = m ? curveProps[m[1]!] : undefined
  if (!m || !prop) return undefined
  const axis = m[3] ? curveAxes(prop)[m[3] as 'x' | 'y'] : undefined
  return `${String(prop.title ?? m[1])}, point ${Number(m[2]) + 1}${axis ? `, ${String(axis.title ?? m[3]).toLowerCase()}` : ''}`
}

// Where a field stands among its record's fields (a drive unit's settings in the order it lists them), so a
// change reads in the form's order rather than the order the database keeps its keys in.
const ranks = Object.fromEntries(Object.entries(byEntity).map(([entity, labels]) => [entity, new Map(Object.keys(labels).map((path, i) => [path, i]))]))

export function knownChangeRank(entityType: string | undefined, path: string): number {
  const rank = entityType ? ranks[entityType] : undefined
  for (let p = path; rank && p; p = p.slice(0, Math.max(0, p.lastIndexOf('/')))) {
    const i = rank.get(p)
    if (i !== undefined) return i
  }
  return Number.MAX_SAFE_INTEGER
}

export function knownChangeLabel(entityType: string | undefined, path: string): string | undefined {
  if (!entityType) return undefined
  return byEntity[entityType]?.[path] ?? (entityType === 'version' ? pointLabel(path) : undefined)
}
