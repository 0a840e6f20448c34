// What a road test's signature covers (its content hash): the record as tested, the tested version's own
// hash and every stored file's hash, with the time of signing. Used by sign-off and the demo seeder.
export interface RoadTestRecordContent {
  roadTestId: number
  vehicleId: number
  versionId: number
  versionContentHash: string
  testerId: number
  testedAt: Date | string
  conditions: unknown
  checks: unknown
  checkList?: unknown // the workshop's own checks it was recorded with; left out when there were none, as before them
  verdict: string
  preDrive?: unknown // the tester's pre-drive confirmation; left out on records made before it was asked
  telemetry: { summary: unknown, sha256: string | null }[]
  files: { id: number, sha256: string }[]
  signedAt: Date | string
}

export function roadTestRecordContent(r: RoadTestRecordContent) {
  return { ...r, testedAt: new Date(r.testedAt).toISOString(), signedAt: new Date(r.signedAt).toISOString() }
}
