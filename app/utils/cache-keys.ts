// The keys of what the screens read (useFetch), in one place: a write names what it changed, and every screen
// showing it reads it again.
export const cacheKeys = {
  vehicle: (id: number) => `vehicle-${id}`,
  profiles: (vehicleId: number) => `profiles-${vehicleId}`,
  version: (id: number) => `version-${id}`,
  readbacks: (vehicleId: number) => `readbacks-${vehicleId}`,
  vehicleRoadTests: (vehicleId: number) => `vehicle-road-tests-${vehicleId}`,
  roadTest: (id: number) => `road-test-${id}`,
  roadTestChart: (id: number) => `road-test-chart-${id}`,
  roadTestBrief: (versionId: number) => `road-test-brief-${versionId}`,
  handover: (vehicleId: number) => `handover-${vehicleId}`,
  clientCar: (vehicleId: number) => `client-car-${vehicleId}`,
  platform: (key: string | null | undefined) => `platform-${key}`,
  diff: (a: number, b: number) => `diff-${a}-${b}`,
  driftedCars: 'drifted-cars',
  reviews: 'worklist-reviews',
  drafts: 'worklist-drafts',
  awaitingRoadTests: 'road-tests-awaiting',
  people: 'people',
  platforms: 'platforms',
  workshop: 'workshop',
  snagAssignees: 'snag-assignees'
} as const

// After a write to a car: its history and page read again, with whatever else the write touched.
export async function carChanged(vehicleId: number, ...also: string[]) {
  useHistoryRevision(vehicleId).value++
  useHistoryRevision().value++
  await refreshNuxtData([cacheKeys.vehicle(vehicleId), cacheKeys.handover(vehicleId), ...also])
}
