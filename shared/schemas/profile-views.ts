// What the profile, version, diff and worklist routes answer.
import type { Curves, Evaluation, EvaluationError, Figures, NullReasons, PlatformLike, Warning } from '../compute/types'
import type { VersionOrigin, VersionState } from './version'
import type { VehicleView } from './vehicle'

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
}

export interface HistoryEntry { id: string, action: string, actor: PersonRef | null, createdAt: string, data: Record<string, unknown> }

export interface VersionView extends Omit<VersionSummary, 'lastReview'> {
  parameters: Record<string, number>
  justifications: Record<string, string>
  evaluation: EvaluationSnapshot | null
  contentHash: string
  lockVersion: number
  onCar: boolean
  profile: { id: number, name: string, onCarVersionId: number | null }
  vehicle: VehicleView
  platform: PlatformLike
  parent: { id: number, versionNo: number } | null
  reviews: ReviewView[]
  history: HistoryEntry[]
  liveEvaluation: Evaluation
}

export interface ParameterDiffRow {
  name: string
  label: string
  unit: string
  before: number | null
  after: number | null
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
  a: { id: number, versionNo: number, profileName: string, state: VersionState, vehicleId: number }
  b: { id: number, versionNo: number, profileName: string, state: VersionState, vehicleId: number }
  rows: ParameterDiffRow[]
  figures: FigureDiffRow[]
  warnings: WarningDiff
  patch: { op: string, path: string, value?: unknown, from?: string }[]
  evaluations: { a: VersionSide, b: VersionSide }
}

export interface ReviewWorkItem {
  versionId: number
  versionNo: number
  profileName: string
  vehicle: { id: number, stockRef: string, make: string, model: string, year: number }
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
  vehicle: { id: number, stockRef: string, make: string, model: string, year: number }
  updatedAt: string
  review: ReviewView | null
}
