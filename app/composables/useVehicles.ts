import type { VehicleUpdate, VehicleStatus, VehicleView } from '~~/shared/schemas/vehicle'

export interface VehicleListState { q: string, status: VehicleStatus | '', sort: string, dir: 'asc' | 'desc', page: number, pageSize: number }

export function useVehicleList(state: Ref<VehicleListState>) {
  const query = computed(() => ({ ...state.value, q: state.value.q || undefined, status: state.value.status || undefined }))
  return useFetch<{ items: VehicleView[], total: number }>('/api/vehicles', { key: () => `vehicles:${JSON.stringify(query.value)}`, query })
}

export function useVehicle(id: MaybeRefOrGetter<number>) {
  const data = useFetch<VehicleView>(() => `/api/vehicles/${toValue(id)}`, { key: () => cacheKeys.vehicle(toValue(id)) })
  async function save(changes: VehicleUpdate) {
    const saved = await $fetch<VehicleView>(`/api/vehicles/${toValue(id)}`, { method: 'PATCH', body: changes })
    data.data.value = saved
    useHistoryRevision(saved.id).value++
    return saved
  }
  return { ...data, save }
}
