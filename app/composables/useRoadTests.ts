import type { WorkshopCheck } from '~~/shared/schemas/workshop-checks'
import type { SettingValues } from '~~/shared/compute/parameter-input'
import type { RoadTestCreate, RoadsideVersionInput } from '~~/shared/schemas/road-test'
import type { AwaitingRoadTest, RoadTestChart, RoadTestListItem, RoadTestView } from '~~/shared/schemas/road-test-views'
import type { PlatformLike, Severity } from '~~/shared/compute/types'
import type { VehicleSpec } from '~~/shared/schemas/vehicle-spec'
import type { VersionView } from '~~/shared/schemas/profile-views'

export interface RoadTestBrief {
  version: { id: number, versionNo: number, state: string, authorId: number, parameters: SettingValues }
  profile: { id: number, name: string, onCarVersionNo: number | null } // the signed-off version to go back to, if any
  vehicle: { id: number, stockRef: string, make: string, model: string, year: number, platformKey: string | null, spec: VehicleSpec }
  platform: PlatformLike
  platformSchema: Record<string, unknown> | null
  expected: { maxStartGradePct: number | null, creepHoldGradePct: number | null, liftOffDecelMs2: number | null, brakeRegenDecelMs2: number | null, topSpeedKph: number | null, zeroTo50S: number | null, regenGripLimitMs2: { dry: number | null, wet: number | null, snow: number | null }, derateStartC?: { motor: number | null, inverter: number | null, battery: number | null } }
  warnings: { rule: string, severity: Severity, message: string }[]
  extraChecks: WorkshopCheck[]
  failedEarlier: { id: number, testedAt: string } | null // the latest failed road test of this version
  blockingSnags: { id: number, title: string }[] // the car's open blocking snags: a sign-off waits for them
}

export interface SignOffMissing { code: string, message: string, check?: string, snags?: { id: number, title: string }[] }

export function useRoadTestBrief(versionId: MaybeRefOrGetter<number>) {
  // Waits for a version id (the road-test page learns it from the record it loads first).
  return useFetch<RoadTestBrief>(() => `/api/versions/${toValue(versionId)}/road-test-brief`, { key: () => cacheKeys.roadTestBrief(toValue(versionId)), immediate: toValue(versionId) > 0 })
}

export function useVehicleRoadTests(vehicleId: MaybeRefOrGetter<number>) {
  return useFetch<{ items: RoadTestListItem[], total: number }>(() => `/api/vehicles/${toValue(vehicleId)}/road-tests`, { key: () => cacheKeys.vehicleRoadTests(toValue(vehicleId)) })
}

export function useAwaitingRoadTests() {
  return useFetch<{ items: AwaitingRoadTest[], total: number }>('/api/road-tests/awaiting', { key: cacheKeys.awaitingRoadTests })
}

export function useRoadTest(id: MaybeRefOrGetter<number>) {
  const record = useFetch<RoadTestView>(() => `/api/road-tests/${toValue(id)}`, { key: () => cacheKeys.roadTest(toValue(id)) })
  const chart = useFetch<RoadTestChart>(() => `/api/road-tests/${toValue(id)}/chart`, { key: () => cacheKeys.roadTestChart(toValue(id)) })

  async function refreshAll() {
    await Promise.all([record.refresh(), chart.refresh()])
  }
  async function signOff() {
    const result = await $fetch(`/api/road-tests/${toValue(id)}/sign-off`, { method: 'POST' })
    await refreshAll()
    return result
  }
  async function recordRoadside(input: RoadsideVersionInput) {
    const created = await $fetch<VersionView>(`/api/road-tests/${toValue(id)}/roadside-version`, { method: 'POST', body: input })
    // The answer is the new version, already in review: the engineers' list and the car's profiles now hold it.
    await Promise.all([record.refresh(), carChanged(created.vehicle!.id, cacheKeys.profiles(created.vehicle!.id), cacheKeys.reviews)])
    return created
  }
  return { record, chart, refreshAll, signOff, recordRoadside }
}

export async function saveRoadTest(versionId: number, input: RoadTestCreate) {
  return $fetch<RoadTestView>(`/api/versions/${versionId}/road-tests`, { method: 'POST', body: input })
}

export interface UploadAnswer<T = unknown> { status: number, body: T & { message?: string, data?: Record<string, unknown> } }

// XMLHttpRequest rather than fetch: only XHR reports upload progress in every browser.
export function uploadWithProgress<T>(url: string, file: File, onProgress: (fraction: number) => void): Promise<UploadAnswer<T>> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    const form = new FormData()
    form.append('file', file, file.name)
    xhr.open('POST', url)
    xhr.responseType = 'json'
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total)
    }
    xhr.onload = () => resolve({ status: xhr.status, body: (xhr.response ?? {}) as UploadAnswer<T>['body'] })
    xhr.onerror = () => reject(new Error('The upload did not reach the server. Check the connection and try again.'))
    xhr.send(form)
  })
}
