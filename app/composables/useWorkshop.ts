import type { WorkshopSettings, WorkshopSettingsInput } from '~~/shared/compute/settings'

export interface WorkshopView { id: number, name: string, settings: WorkshopSettings }

// The signed-in person's workshop: its rule thresholds and how it likes numbers shown.
export function useWorkshop() {
  const data = useFetch<WorkshopView>('/api/workshop', { key: cacheKeys.workshop })
  async function changeSettings(change: Partial<WorkshopSettingsInput>) {
    const saved = await $fetch<WorkshopView>('/api/workshop/settings', { method: 'PATCH', body: change })
    data.data.value = saved
    return saved
  }
  return { ...data, changeSettings }
}
