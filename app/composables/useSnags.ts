import type { SnagCreate, SnagUpdate, SnagView } from '~~/shared/schemas/snag'

export interface SnagFilters { kind?: string, status?: string, priority?: string, blocking?: string }
const clean = (f: SnagFilters) => Object.fromEntries(Object.entries(f).filter(([, v]) => v))

// A car's snag list, or the workshop's when no car is given.
export function useSnagList(vehicleId: MaybeRefOrGetter<number | null>, filters: Ref<SnagFilters>) {
  const url = () => toValue(vehicleId) ? `/api/vehicles/${toValue(vehicleId)}/snags` : '/api/snags'
  const query = computed(() => clean(filters.value))
  const list = useFetch<{ items: SnagView[], total: number }>(url, { key: () => `snags-${toValue(vehicleId) ?? 'all'}-${JSON.stringify(query.value)}`, query })

  async function add(carId: number, input: Partial<SnagCreate>) {
    const created = await raiseSnag(carId, input)
    await list.refresh()
    return created
  }
  async function change(id: number, changes: SnagUpdate) {
    const saved = await $fetch<SnagView>(`/api/snags/${id}`, { method: 'PATCH', body: changes })
    // The answer is the snag as saved: it replaces the row, and the car's history and page read again.
    if (list.data.value) list.data.value = { ...list.data.value, items: list.data.value.items.map(s => s.id === id ? saved : s) }
    await carChanged(saved.vehicleId, cacheKeys.vehicleRoadTests(saved.vehicleId))
    return saved
  }
  return { ...list, add, change }
}

export function useSnagAssignees() {
  return useFetch<{ items: { id: number, name: string }[] }>('/api/snags/assignees', { key: cacheKeys.snagAssignees })
}

export async function raiseSnag(carId: number, input: Partial<SnagCreate>) {
  const created = await $fetch<SnagView>(`/api/vehicles/${carId}/snags`, { method: 'POST', body: input })
  await carChanged(carId)
  return created
}
