import type { SearchAnswer, SearchCondition } from '~~/shared/schemas/fleet-search'

// Runs a fleet search for the conditions given; more pages on demand; the CSV of the same search.
export function useFleetSearch(conditions: Ref<SearchCondition[]>) {
  const body = computed(() => ({ conditions: conditions.value, limit: 50 }))
  const data = useFetch<SearchAnswer>('/api/fleet/search', { method: 'POST', body, key: () => `fleet-search-${JSON.stringify(body.value)}`, watch: [body] })
  const more = ref<SearchAnswer['items']>([])
  const next = ref<string | null>(null)
  watch(data.data, (d) => { more.value = []; next.value = d?.nextCursor ?? null })
  async function loadMore() {
    const page = await $fetch<SearchAnswer>('/api/fleet/search', { method: 'POST', body: { ...body.value, cursor: next.value } })
    more.value = [...more.value, ...page.items]
    next.value = page.nextCursor
  }
  async function downloadCsv() {
    const blob = await $fetch<Blob>('/api/fleet/search.csv', { method: 'POST', body: { conditions: conditions.value }, responseType: 'blob' })
    const link = document.createElement('a')
    link.href = URL.createObjectURL(blob)
    link.download = 'voltwright-fleet-search.csv'
    link.click()
    URL.revokeObjectURL(link.href)
  }
  const items = computed(() => [...(data.data.value?.items ?? []), ...more.value])
  return { ...data, items, next, loadMore, downloadCsv }
}
