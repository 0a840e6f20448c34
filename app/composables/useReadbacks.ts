import type { OnCarProfile, ReadbackBody, ReadbackView } from '~~/shared/schemas/readback'
import type { ClientCarView } from '~~/shared/schemas/client-view'

export interface ReadbackList { items: ReadbackView[], onCar: OnCarProfile[], driftedAt: string | null }
export interface DriftedCar { id: number, stockRef: string, make: string, model: string, driftedAt: string, differences: ReadbackView['differences'] }

export function useReadbacks(vehicleId: MaybeRefOrGetter<number>) {
  const list = useFetch<ReadbackList>(() => `/api/vehicles/${toValue(vehicleId)}/readbacks`, { key: () => cacheKeys.readbacks(toValue(vehicleId)) })
  async function record(body: ReadbackBody) {
    const saved = await $fetch<ReadbackView>(`/api/vehicles/${toValue(vehicleId)}/readback`, { method: 'POST', body })
    await Promise.all([list.refresh(), carChanged(toValue(vehicleId), cacheKeys.driftedCars)])
    return saved
  }
  return { ...list, record }
}

export function useDriftedCars() {
  return useFetch<{ items: DriftedCar[], total: number }>('/api/drift', { key: cacheKeys.driftedCars })
}

export function useClientCar(vehicleId: MaybeRefOrGetter<number>) {
  return useFetch<ClientCarView>(() => `/api/vehicles/${toValue(vehicleId)}/client-view`, { key: () => cacheKeys.clientCar(toValue(vehicleId)) })
}
