import type { WorkshopCheck, WorkshopCheckCreate, WorkshopCheckPatch } from '~~/shared/schemas/workshop-checks'

// The workshop's own road-test checks, for the admin's list; writes refresh the list.
export function useWorkshopChecks() {
  const list = useFetch<{ items: WorkshopCheck[], total: number }>('/api/workshop/checks', { key: 'workshop-checks' })
  async function add(input: WorkshopCheckCreate) {
    const created = await $fetch<WorkshopCheck>('/api/workshop/checks', { method: 'POST', body: input })
    await list.refresh()
    return created
  }
  async function change(key: string, input: WorkshopCheckPatch) {
    const changed = await $fetch<WorkshopCheck>(`/api/workshop/checks/${key}`, { method: 'PATCH', body: input })
    await list.refresh()
    return changed
  }
  return { ...list, add, change }
}
