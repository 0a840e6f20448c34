// Fleet search: the fields a condition may name (an allow-list; the server maps each to SQL of its own),
// the operators, and the request (docs/fleet.md).
import { z } from 'zod'
import { ownUnit } from '../compute/quantities'
import { ROLE_NAMES, ROLES, type RoleInfo } from '../compute/roles'
import { ruleTitles } from '../compute/rule-titles'
import { RULE_IDS } from '../compute/types'
import { vehicleStatuses, vehicleStatusLabels } from './vehicle'

export const searchOps = ['eq', 'ne', 'lt', 'le', 'gt', 'ge', 'in'] as const
export type SearchOp = typeof searchOps[number]
export const searchOpLabels: Record<SearchOp, string> = { eq: 'is', ne: 'is not', lt: 'below', le: 'at most', gt: 'above', ge: 'at least', in: 'is one of' }

export interface SearchField { key: string, label: string, unit: string, group: string, kind: 'number' | 'text' | 'choice', choices?: { value: string, label: string }[], help?: string }

const num = (group: string, key: string, label: string, unit = ''): SearchField => ({ key, label, unit, group, kind: 'number' })
export const ROLE_GROUP = 'Settings by what they do (any drive unit)'
// A setting by its role: the same quantity whichever drive unit, read in the role's own unit.
const roleField = (info: RoleInfo): SearchField => ({
  ...num(ROLE_GROUP, `setting.${info.field}`, info.words[0]!.toUpperCase() + info.words.slice(1), ownUnit(info.quantity)),
  help: `The ${info.words} setting of whichever drive unit the car has, in ${ownUnit(info.quantity)}.`
})
// The drive unit as a choice by name; the names come from the workshop's drive units on the screen.
export const DRIVE_UNIT_FIELD = 'car.driveUnit'

export const searchFields: SearchField[] = [
  { key: 'car.make', label: 'Make', unit: '', group: 'The car', kind: 'text' },
  { key: 'car.model', label: 'Model', unit: '', group: 'The car', kind: 'text' },
  num('The car', 'car.year', 'Year'),
  { key: 'car.status', label: 'Stage', unit: '', group: 'The car', kind: 'choice', choices: vehicleStatuses.map(s => ({ value: s, label: vehicleStatusLabels[s] })) },
  { key: DRIVE_UNIT_FIELD, label: 'Drive unit', unit: '', group: 'The car', kind: 'choice', choices: [] },
  { key: 'spec.drivenAxle', label: 'Driven wheels', unit: '', group: 'Chassis', kind: 'choice', choices: [{ value: 'rear', label: 'Rear' }, { value: 'front', label: 'Front' }, { value: 'all', label: 'All' }] },
  num('Chassis', 'spec.kerbMassKg', 'Kerb mass', 'kg'),
  num('Chassis', 'spec.frontAxleLoadPct', 'Share of mass on the front axle', '%'),
  num('Chassis', 'spec.wheelbaseMm', 'Wheelbase', 'mm'),
  num('Chassis', 'spec.cgHeightMm', 'Centre-of-gravity height', 'mm'),
  num('Chassis', 'spec.originalEnginePowerKw', 'Original engine power', 'kW'),
  num('Chassis', 'spec.packNominalVoltageV', 'Pack voltage', 'V'),
  num('Chassis', 'spec.packCapacityKwh', 'Pack capacity', 'kWh'),
  ...ROLE_NAMES.map(r => roleField(ROLES[r])),
  num('What the settings do', 'figure.liftOffOverSnowGripMs2', 'Lift-off deceleration above the snow grip limit', 'm/s²'),
  num('What the settings do', 'figure.liftOffOverWetGripMs2', 'Lift-off deceleration above the wet grip limit', 'm/s²'),
  num('What the settings do', 'figure.liftOffDecelMs2', 'Lift-off deceleration at 50 km/h', 'm/s²'),
  num('What the settings do', 'figure.brakeRegenDecelMs2', 'Brake regen deceleration at 50 km/h', 'm/s²'),
  num('What the settings do', 'figure.gripWetMs2', 'Regen grip limit, wet', 'm/s²'),
  num('What the settings do', 'figure.gripSnowMs2', 'Regen grip limit, snow', 'm/s²'),
  num('What the settings do', 'figure.zeroTo100S', '0-100 km/h', 's'),
  num('What the settings do', 'figure.topSpeedKph', 'Top speed', 'km/h'),
  num('What the settings do', 'figure.maxStartGradePct', 'Steepest hill start', '%'),
  num('What the settings do', 'figure.powerRatioToOriginal', 'Power against the original engine', 'times'),
  num('What the settings do', 'figure.peakDischargeCurrentA', 'Peak battery current', 'A'),
  num('What the settings do', 'figure.dangerCount', 'Danger warnings', ''),
  { key: 'warning', label: 'Warning raised', unit: '', group: 'Warnings', kind: 'choice', choices: RULE_IDS.map(r => ({ value: r, label: ruleTitles[r].title })) }
]

// A setting by name within one drive unit: "unit.<key>.<setting>" (the unit's key and the setting's name are
// bound values, never SQL; the server checks the unit has that number setting).
export const UNIT_SETTING = /^unit\.([a-z0-9][a-z0-9-]{0,59})\.([A-Za-z][A-Za-z0-9]{0,39})$/
export const unitSettingField = (unitKey: string, setting: string) => `unit.${unitKey}.${setting}`

// The fields a result shows a value for: each condition's field once, but not the warnings or the drive unit,
// which every result shows anyway.
export const resultFields = (conditions: { field: string }[]) => [...new Set(conditions.map(c => c.field))].filter(f => f !== 'warning' && f !== DRIVE_UNIT_FIELD)

const value = z.union([z.number().finite(), z.string().trim().max(80)])
export const searchConditionSchema = z.object({
  field: z.string().max(120),
  op: z.enum(searchOps, { error: 'Choose is, is not, below, at most, above, at least or is one of' }),
  value: z.union([value, z.array(value).min(1).max(50)])
}).strict()
export type SearchCondition = z.output<typeof searchConditionSchema>

export const searchRequestSchema = z.object({
  conditions: z.array(searchConditionSchema).max(12, 'At most 12 conditions').default([]),
  sort: z.object({ field: z.string().max(120), dir: z.enum(['asc', 'desc']).default('asc') }).strict().optional(),
  limit: z.number().int().min(1).max(500).default(50),
  cursor: z.string().max(400).optional()
}).strict()
export type SearchRequest = z.output<typeof searchRequestSchema>

export interface SearchItem {
  vehicleId: number
  stockRef: string
  make: string
  model: string
  year: number
  status: string
  driveUnit: string
  profileName: string
  versionId: number
  versionNo: number
  // The last read-back of the controller differed from this version (drift), since then.
  driftedAt: string | null
  warnings: string[]
  values: Record<string, number | string | null>
}
export interface SearchAnswer { items: SearchItem[], total: number, nextCursor: string | null }
