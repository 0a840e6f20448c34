export const versionStates = ['draft', 'in-review', 'approved', 'rejected', 'signed-off', 'superseded', 'withdrawn'] as const
export type VersionState = typeof versionStates[number]
export const versionStateLabels: Record<VersionState, string> = {
  'draft': 'Draft',
  'in-review': 'Awaiting review',
  'approved': 'Approved, awaiting road test',
  'rejected': 'Sent back',
  'signed-off': 'Signed off — on the car',
  'superseded': 'Superseded',
  'withdrawn': 'Withdrawn'
}
export const versionOrigins = ['workshop', 'roadside'] as const
export type VersionOrigin = typeof versionOrigins[number]
