// Voltwright's own needs of a drive unit's settings schema, beyond JSON Schema 2020-12: each setting of a
// kind the form can show, roles known and unique, units convertible. Every problem names its JSON pointer.
import { quantityOfUnit } from '../compute/quantities'
import { isRole, ROLES, roleValue, type Role } from '../compute/roles'
import { finite, settingKind, settingProblems, type LooseProperty } from '../compute/setting-kinds'

export const MAX_SETTINGS = 100
export const MAX_CURVE_POINTS = 64
const NAME = /^[A-Za-z][A-Za-z0-9]{0,39}$/

type Problems = string[]
const at = (pointer: string, message: string) => `${pointer}: ${message}`

function rangeProblems(p: LooseProperty, ptr: string, out: Problems): void {
  for (const k of ['minimum', 'maximum']) if (!finite(p[k])) out.push(at(`${ptr}/${k}`, 'must be a number'))
  if (finite(p.minimum) && finite(p.maximum) && p.minimum >= p.maximum) out.push(at(ptr, 'minimum must be below maximum'))
  if (p.multipleOf !== undefined && !(finite(p.multipleOf) && p.multipleOf > 0)) out.push(at(`${ptr}/multipleOf`, 'must be a number above 0'))
  if (typeof p.unit !== 'string' || p.unit.trim() === '' || p.unit.length > 20) out.push(at(`${ptr}/unit`, 'must name the unit, e.g. "kW"'))
}

function roleProblems(p: LooseProperty, ptr: string, seen: Map<Role, string>, facts: { torqueConstantNmPerA?: unknown }, out: Problems): void {
  const role = p['x-role']
  if (role === undefined) return
  if (!isRole(role)) return void out.push(at(`${ptr}/x-role`, `"${String(role).slice(0, 40)}" is not a role Voltwright knows`))
  if (seen.has(role)) out.push(at(`${ptr}/x-role`, `the ${ROLES[role].words} is already given by ${seen.get(role)}`))
  seen.set(role, ptr)
  if (p.type !== 'number' && p.type !== 'integer') return void out.push(at(`${ptr}/x-role`, 'only a number setting can stand for a role'))
  const unit = typeof p.unit === 'string' ? p.unit : ''
  const constant = finite(facts.torqueConstantNmPerA) ? facts.torqueConstantNmPerA : null
  if (roleValue(role, 1, unit, constant) === null) {
    const info = ROLES[role] as { quantity: string, viaCurrent?: boolean }
    const why = unit === 'A' && info.viaCurrent
      ? 'a motor current in A needs the drive unit\'s torque constant (N·m per A)'
      : `${unit || 'no unit'} does not convert to ${info.quantity}${quantityOfUnit(unit) ? ` (it is a ${quantityOfUnit(unit)})` : ''}`
    out.push(at(`${ptr}/unit`, why))
  }
}

function enumProblems(p: LooseProperty, ptr: string, out: Problems): void {
  const values = p.enum as unknown[]
  if (values.length < 2 || values.length > 20) out.push(at(`${ptr}/enum`, 'needs from 2 to 20 choices'))
  if (values.some(v => typeof v !== 'string' || v === '' || v.length > 40)) out.push(at(`${ptr}/enum`, 'each choice must be a short word'))
  const titles = p['x-enumTitles']
  if (titles !== undefined && (!Array.isArray(titles) || titles.length !== values.length || titles.some(t => typeof t !== 'string' || t.length > 60))) {
    out.push(at(`${ptr}/x-enumTitles`, 'must give one label per choice'))
  }
}

function curveProblems(p: LooseProperty, ptr: string, out: Problems): void {
  const items = (p.items ?? {}) as LooseProperty
  const props = (items.properties ?? {}) as Record<string, LooseProperty>
  if (items.type !== 'object' || Object.keys(props).sort().join() !== 'x,y') out.push(at(`${ptr}/items`, 'a curve\'s points must be objects with x and y'))
  for (const axis of ['x', 'y']) {
    const a = props[axis]
    if (!a) continue
    if (a.type !== 'number') out.push(at(`${ptr}/items/properties/${axis}/type`, 'must be "number"'))
    rangeProblems(a, `${ptr}/items/properties/${axis}`, out)
  }
  const max = p.maxItems
  if (!finite(max) || max > MAX_CURVE_POINTS || max < 2) out.push(at(`${ptr}/maxItems`, `must be from 2 to ${MAX_CURVE_POINTS}`))
  if (p['x-monotonic'] !== undefined && typeof p['x-monotonic'] !== 'boolean') out.push(at(`${ptr}/x-monotonic`, 'must be true or false'))
}

export function settingProblemsOf(name: string, p: LooseProperty, seen: Map<Role, string>, facts: { torqueConstantNmPerA?: unknown }): Problems {
  const ptr = `/properties/${name}`
  const out: Problems = []
  if (!NAME.test(name)) out.push(at(ptr, 'a setting\'s name must be a letter then up to 39 letters or digits'))
  if (!p || typeof p !== 'object' || Array.isArray(p)) return [...out, at(ptr, 'must be an object')]
  const kind = settingKind(p)
  if (!kind) return [...out, at(`${ptr}/type`, 'must be "number", "integer" or "boolean", an enumeration (enum) or a curve ("array")')]
  if (typeof p.title !== 'string' || p.title.trim() === '' || p.title.length > 80) out.push(at(`${ptr}/title`, 'must give the setting a short name in words'))
  if (kind === 'number' || kind === 'integer') rangeProblems(p, ptr, out)
  if (kind === 'enumeration') enumProblems(p, ptr, out)
  if (kind === 'curve') curveProblems(p, ptr, out)
  roleProblems(p, ptr, seen, facts, out)
  if (out.length === 0) {
    if (p.default === undefined) out.push(at(`${ptr}/default`, 'a default is needed, the value a new profile starts from'))
    else for (const m of settingProblems(p.default, p, name)) out.push(at(`${ptr}/default`, m))
  }
  return out
}

export function settingsProblems(schema: Record<string, unknown>, facts: { torqueConstantNmPerA?: unknown }): Problems {
  const props = schema.properties
  if (props === null || typeof props !== 'object' || Array.isArray(props) || Object.keys(props).length === 0) return ['/properties: must list the drive unit\'s settings']
  const entries = Object.entries(props as Record<string, LooseProperty>)
  if (entries.length > MAX_SETTINGS) return [`/properties: at most ${MAX_SETTINGS} settings`]
  const seen = new Map<Role, string>()
  return entries.flatMap(([name, p]) => settingProblemsOf(name, p, seen, facts))
}
