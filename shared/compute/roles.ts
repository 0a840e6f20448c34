// The quantities the physics knows (roles). A drive unit's schema marks the setting that stands for each
// with "x-role"; roleValues reads them in the role's own unit. See docs/computation.md, "Roles".
import type { ParameterName } from './parameters'
import { ownUnit, toOwnUnit, type Quantity } from './quantities'

export interface RoleInfo { field: ParameterName, quantity: Quantity, words: string, viaCurrent?: boolean }

export const ROLES = {
  powerCap: { field: 'powerCapKw', quantity: 'power', words: 'power cap' },
  torqueCap: { field: 'torqueCapNm', quantity: 'torque', words: 'torque cap', viaCurrent: true },
  regenTorqueLimit: { field: 'regenTorqueLimitNm', quantity: 'torque', words: 'regen torque limit', viaCurrent: true },
  liftOffRegen: { field: 'liftOffRegenPct', quantity: 'share', words: 'lift-off regen' },
  brakeRegen: { field: 'brakeRegenPct', quantity: 'share', words: 'brake regen' },
  creepTorque: { field: 'creepTorqueNm', quantity: 'torque', words: 'creep' },
  creepSpeed: { field: 'creepSpeedKph', quantity: 'speed', words: 'creep speed' },
  speedLimit: { field: 'speedLimitKph', quantity: 'speed', words: 'speed limit' },
  reverseSpeedLimit: { field: 'reverseSpeedLimitKph', quantity: 'speed', words: 'reverse speed limit' },
  throttleProgression: { field: 'throttleProgression', quantity: 'share', words: 'throttle progression' },
  motorDerateStart: { field: 'motorDerateStartC', quantity: 'temperature', words: 'motor derate start' },
  motorCutoff: { field: 'motorCutoffC', quantity: 'temperature', words: 'motor cut-off' },
  inverterDerateStart: { field: 'inverterDerateStartC', quantity: 'temperature', words: 'inverter derate start' },
  inverterCutoff: { field: 'inverterCutoffC', quantity: 'temperature', words: 'inverter cut-off' },
  batteryDerateStart: { field: 'batteryDerateStartC', quantity: 'temperature', words: 'battery derate start' },
  batteryCutoff: { field: 'batteryCutoffC', quantity: 'temperature', words: 'battery cut-off' },
  batteryDischargeLimit: { field: 'batteryDischargeLimitA', quantity: 'current', words: 'battery discharge limit' },
  batteryChargeLimit: { field: 'batteryChargeLimitA', quantity: 'current', words: 'battery charge limit' }
} as const satisfies Record<string, RoleInfo>

export type Role = keyof typeof ROLES
export const ROLE_NAMES = Object.keys(ROLES) as Role[]
export const isRole = (x: unknown): x is Role => typeof x === 'string' && Object.hasOwn(ROLES, x)

// The role values in their own units (kW, N·m, %, km/h, °C, A), null where the controller lacks the role.
export type RoleValues = Record<ParameterName, number | null>

export interface RoleReading {
  values: RoleValues
  missing: Role[] // roles no setting stands for
  problems: { path: string, message: string }[] // a role whose setting cannot be read in its unit
}

export const noSetting = (role: Role): string => `This controller has no ${ROLES[role].words} setting`

type Loose = Record<string, unknown>

// The setting (property name) that stands for each role in a schema; the first wins if one is repeated.
export function roleSettings(schema: unknown): Partial<Record<Role, string>> {
  const props = ((schema as Loose | null)?.properties ?? {}) as Record<string, Loose>
  const out: Partial<Record<Role, string>> = {}
  for (const [name, p] of Object.entries(props)) {
    const role = p?.['x-role']
    if (isRole(role) && !out[role]) out[role] = name
  }
  return out
}

// Converts one setting to its role's unit; a current in A becomes torque through the torque constant.
export function roleValue(role: Role, value: number, unit: string, torqueConstantNmPerA?: number | null): number | null {
  const info: RoleInfo = ROLES[role]
  if (info.viaCurrent && unit === 'A') {
    return typeof torqueConstantNmPerA === 'number' && torqueConstantNmPerA > 0 ? value * torqueConstantNmPerA : null
  }
  return toOwnUnit(value, unit, info.quantity)
}

export function roleValues(schema: unknown, parameters: Record<string, unknown>, unitFacts: { torqueConstantNmPerA?: number | null } = {}): RoleReading {
  const props = ((schema as Loose | null)?.properties ?? {}) as Record<string, Loose>
  const settings = roleSettings(schema)
  const values = {} as RoleValues
  const missing: Role[] = []
  const problems: RoleReading['problems'] = []
  for (const role of ROLE_NAMES) {
    const info: RoleInfo = ROLES[role]
    values[info.field] = null
    const name = settings[role]
    if (name === undefined) {
      missing.push(role)
      continue
    }
    const raw = parameters[name]
    const unit = typeof props[name]?.unit === 'string' ? props[name].unit as string : ownUnit(info.quantity)
    if (typeof raw !== 'number' || !Number.isFinite(raw)) {
      problems.push({ path: `parameters.${name}`, message: `The ${info.words} needs a number` })
      continue
    }
    const converted = roleValue(role, raw, unit, unitFacts.torqueConstantNmPerA)
    if (converted === null) {
      const why = unit === 'A' ? 'the drive unit states no torque constant (N·m per A)' : `${unit} is not a unit of ${info.quantity}`
      problems.push({ path: `parameters.${name}`, message: `The ${info.words} cannot be used: ${why}` })
    }
    values[info.field] = converted
  }
  return { values, missing, problems }
}
