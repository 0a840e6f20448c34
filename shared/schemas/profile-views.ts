import type { SettingValues } from '../compute/parameter-input'
// What the profile, version, diff and worklist routes answer.
import type { Curves, Evaluation, EvaluationError, Figures, NullReasons, PlatformLike, Warning } from '../compute/types'
import type { VersionOrigin, VersionState } from './version'
import type { VehicleView } from './vehicle'
import type { VehicleSpec } from './vehicle-spec'

export interface PersonRef { id: number, name: string }

// The evaluation kept with a version when it left draft: what the reviewer was shown.
export interface EvaluationSnapshot {
  valid: boolean
  errors: EvaluationError[]
  warnings: Warning[]
  figures: Figures
  nullReasons: NullReasons
  evaluatedAt: string
}

export interface VersionSummary {
  id: number
  profileId: number
  versionNo: number
  parentVersionId: number | null
  state: VersionState
  origin: VersionOrigin
  // The road test a roadside version was recorded on.
  roadTestId: number | null
  author: PersonRef | null
  rationale: string
  dangerCount: number | null
  submittedAt: string | null
  decidedAt: string | null
  createdAt: string
  lastReview: ReviewView | null
}

export interface ReviewView { id: number, decision: 'approve' | 'reject', comment: string, reviewer: PersonRef | null, createdAt: string }

export interface ProfileView {
  id: number
  vehicleId: number
  name: string
  onCarVersionId: number | null
  versions: VersionSummary[]
  baseline: ProfileBaseline | null
}

// A car profile built from a kit: the baseline version it stands on, the settings where the car differs from
// it, and the kit's newer approved baseline when there is one (the baseline moved).
export interface ProfileBaseline {
  kitId: number
  kitName: string
  versionId: number
  versionNo: number
  currentVersionId: number
  differs: string[]
  moved: { versionId: number, versionNo: number } | null
}

export interface HistoryEntry { id: string, action: string, actor: PersonRef | null, createdAt: string, data: Record<string, unknown> }

export interface VersionView extends Omit<VersionSummary, 'lastReview'> {
  parameters: SettingValues
  justifications: Record<string, string>
  evaluation: EvaluationSnapshot | null
  contentHash: string
  lockVersion: number
  onCar: boolean
  profile: { id: number, name: string, onCarVersionId: number | null }
  vehicle: VehicleView | null
  kit: { id: number, name: string, specTemplate: VehicleSpec } | null
  baselineVersionId: number | null
  platform: PlatformLike
  parent: { id: number, versionNo: number } | null
  reviews: ReviewView[]
  history: HistoryEntry[]
  liveEvaluation: Evaluation
}

export interface ParameterDiffRow {
  name: string
  label: string
  unit: string // '' when the two sides give the setting in different units, or it is not a number
  before: unknown
  after: unknown
  beforeText: string // the value in words with its unit: On/Off, a choice's label, a curve's points
  afterText: string
  change: number | null
  changePct: number | null
  changed: boolean
}

export interface FigureDiffRow {
  name: string
  label: string
  unit: string
  before: number | string | null
  after: number | string | null
  change: number | null
  changePct: number | null
  changed: boolean
}

export interface WarningDiff { appeared: Warning[], disappeared: Warning[], kept: { before: Warning, after: Warning }[] }

export interface VersionSide {
  versionId: number
  label: string
  valid: boolean
  errors: EvaluationError[]
  warnings: Warning[]
  figures: Figures
  curves: Curves
}

export interface VersionDiff {
  a: { id: number, versionNo: number, profileName: string, state: VersionState, vehicleId: number | null, kitId: number | null }
  b: { id: number, versionNo: number, profileName: string, state: VersionState, vehicleId: number | null, kitId: number | null }
  rows: ParameterDiffRow[]
  figures: FigureDiffRow[]
  warnings: WarningDiff
  patch: { op: string, path: string, value?: unknown, from?: string }[]
  evaluations: { a: VersionSide, b: VersionSide }
}

export interface WorkItemCar { id: number, stockRef: string, make: string, model: string, year: number }

// How a work item names what its version is for: a car, or a kit's baseline.
export function workItemTitle(i: { vehicle: WorkItemCar | null, kit: { name: string } | null, profileName: string, versionNo: number }): string {
  const of = i.vehicle ? `${i.vehicle.stockRef} ${i.vehicle.make} ${i.vehicle.model}` : `Kit ${i.kit?.name ?? ''}`
  return `${of} — ${i.profileName} v${i.versionNo}`
}

export interface ReviewWorkItem {
  versionId: number
  versionNo: number
  profileName: string
  vehicle: WorkItemCar | null
  kit: { id: number, name: string } | null
  author: PersonRef | null
  submittedAt: string | null
  dangerCount: number
  cautionCount: number
  ownVersion: boolean
}

export interface DraftWorkItem {
  versionId: number
  versionNo: number
  profileName: string
  state: VersionState
  vehicle: WorkItemCar | null
  kit: { id: number, name: string } | null
  updatedAt: string
  review: ReviewView | null
}
