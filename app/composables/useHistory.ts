import type { HistoryEntry, HistoryPage, VerifyResult } from '~~/shared/schemas/history'

export interface HistoryFilters { action: string, actorId: string, from: string, to: string }
export const emptyHistoryFilters = (): HistoryFilters => ({ action: '', actorId: '', from: '', to: '' })

export function historyQuery(f: HistoryFilters) {
  return Object.fromEntries(Object.entries(f).filter(([, v]) => v !== '')) as Record<string, string>
}

const endpoint = (vehicleId?: number) => vehicleId ? `/api/vehicles/${vehicleId}/history` : '/api/audit/events'

// Bumped by any action that writes to a car's history, so the timeline on screen reads it again.
export const useHistoryRevision = (vehicleId?: number) => useState(`history-revision:${vehicleId ?? 'workshop'}`, () => 0)

// One car's history, or the workshop's with no car: the first page through useFetch, older pages appended
// by keyset cursor (each page continues below the last id shown, so nothing repeats as new events arrive).
export function useHistory(vehicleId: MaybeRefOrGetter<number | undefined>, filters: Ref<HistoryFilters>, limit = 25) {
  const query = computed(() => ({ ...historyQuery(filters.value), limit }))
  const revision = useHistoryRevision(toValue(vehicleId))
  const first = useFetch<HistoryPage>(() => endpoint(toValue(vehicleId)), { key: () => `history:${toValue(vehicleId) ?? 'workshop'}:${revision.value}:${JSON.stringify(query.value)}`, query })
  const older = ref<HistoryEntry[]>([])
  const olderCursor = ref<string | null | undefined>(undefined)
  const loadingOlder = ref(false)
  watch(() => first.data.value, () => { older.value = []; olderCursor.value = undefined })

  const items = computed(() => [...(first.data.value?.items ?? []), ...older.value])
  const nextCursor = computed(() => olderCursor.value === undefined ? first.data.value?.nextCursor ?? null : olderCursor.value)

  async function loadOlder() {
    if (!nextCursor.value) return
    loadingOlder.value = true
    try {
      const page = await $fetch<HistoryPage>(endpoint(toValue(vehicleId)), { query: { ...query.value, cursor: nextCursor.value } })
      older.value = [...older.value, ...page.items]
      olderCursor.value = page.nextCursor
    } finally { loadingOlder.value = false }
  }
  return { ...first, items, nextCursor, loadOlder, loadingOlder }
}

export function useHistoryFacets(vehicleId: MaybeRefOrGetter<number | undefined>) {
  return useFetch<{ actions: string[], actors: { id: number, name: string }[] }>('/api/audit/facets', {
    key: () => `history-facets:${toValue(vehicleId) ?? 'workshop'}`, query: computed(() => ({ vehicleId: toValue(vehicleId) }))
  })
}

// Every matching event for the print view, read page by page (up to `max`; the CSV export has no limit).
export function useFullHistory(vehicleId: number, filters: HistoryFilters, max = 5000) {
  const request = useRequestFetch() // on the server, passes the person's cookie on to the API
  return useAsyncData(`history-print:${vehicleId}:${JSON.stringify(filters)}`, async () => {
    const items: HistoryEntry[] = []
    let cursor: string | null = null
    do {
      const page: HistoryPage = await request<HistoryPage>(endpoint(vehicleId), { query: { ...historyQuery(filters), limit: 200, ...(cursor ? { cursor } : {}) } })
      items.push(...page.items)
      cursor = page.nextCursor
    } while (cursor && items.length < max)
    return { items, truncated: Boolean(cursor) }
  })
}

// Runs only when asked: the walk reads every event of the workshop. With an earlier head (the "event:hash"
// line of a head mail), also says whether that event is still in the chain unchanged.
export function useChainVerify(head: Ref<string>) {
  const query = computed(() => (head.value.trim() ? { head: head.value.trim() } : {}))
  return useFetch<VerifyResult>('/api/audit/verify', { key: 'audit-verify', query, immediate: false, server: false, watch: false })
}
