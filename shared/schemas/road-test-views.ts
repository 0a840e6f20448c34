// Road tests as the API answers them.
import type { CheckVerdict } from './road-test'
import type { RecordedCheck } from './workshop-checks'
import type { TelemetrySummary } from '../telemetry/summary'
import type { TelemetrySeries } from '../telemetry/downsample'
import type { VersionState } from './version'
import type { PreDriveRecord } from './road-test-cautions'
import type { SnagKind, SnagStatus } from './snag'

// A mandatory check by its CheckKey, or one of the workshop's own by the key in the road test's checkList.
export interface CheckView { key: string, verdict: CheckVerdict, values: Record<string, number | string | null>, note: string }
export interface AttachmentView { id: number, filename: string, contentType: string, bytes: number, sha256: string, caption: string, hasThumbnail: boolean, createdAt: string }
export interface TelemetryView { id: number, attachment: AttachmentView, summary: TelemetrySummary, createdAt: string }

export interface RoadTestView {
  id: number
  vehicleId: number
  version: { id: number, versionNo: number, state: VersionState, profileId: number, profileName: string, authorId: number, contentHash: string }
  vehicle: { id: number, stockRef: string, make: string, model: string, year: number, status: string }
  tester: { id: number, name: string }
  testedAt: string
  conditions: { surface: 'dry' | 'wet' | 'snow', ambientC: number, route: string }
  checks: CheckView[]
  checkList: RecordedCheck[]
  verdict: 'pass' | 'fail'
  preDrive: PreDriveRecord | null // the tester's tick before setting off; none on records made before it was asked
  signed: { testerId: number, at: string, contentHash: string } | null
  telemetry: TelemetryView[]
  photos: AttachmentView[]
  roadsideVersions: { id: number, versionNo: number, state: string }[]
  // What this road test found, as raised on the car's snag list.
  snags: { id: number, title: string, kind: SnagKind, status: SnagStatus, blocking: boolean }[]
}

export interface RoadTestListItem {
  id: number, testedAt: string, verdict: 'pass' | 'fail', signed: boolean, testerName: string
  versionId: number, versionNo: number, profileName: string, failedChecks: string[] // a mandatory check's key, or an extra check's label
}

// Measured beside predicted: the model's figures for the tested version against the log and the checks.
export interface ModelComparison {
  liftOffDecel: { predictedMs2: number | null, measuredMs2: number | null, gripLimitMs2: number | null, drivenAxle: 'front' | 'rear' | 'all' }
  startGrade: { predictedMaxPct: number | null, testedPct: number | null, limitedBy: string | null }
  rollback: { measuredM: number | null, reportedMm: number | null }
  topSpeed: { predictedKph: number | null, measuredKph: number | null }
}

export interface RoadTestChart { series: TelemetrySeries | null, comparison: ModelComparison }

export interface AwaitingRoadTest {
  versionId: number, versionNo: number, profileId: number, profileName: string, approvedAt: string | null
  vehicle: { id: number, stockRef: string, make: string, model: string, year: number }
  roadTests: number
}
