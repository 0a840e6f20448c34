import { label, settingKind, type LooseProperty } from '~~/shared/compute/setting-kinds'
import { searchFields, UNIT_SETTING, type SearchAnswer, type SearchCondition } from '~~/shared/schemas/fleet-search'

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

export interface SearchUnit { key: string, name: string, settings: { name: string, label: string, unit: string }[] }

// The workshop's drive units by name, each with its number settings by label, for picking a setting of one unit.
export function useSearchUnits() {
  const { data } = usePlatforms()
  const units = computed<SearchUnit[]>(() => (data.value?.items ?? []).map((p) => {
    const props = ((p.schema as { properties?: Record<string, LooseProperty> }).properties ?? {})
    const settings = Object.entries(props).filter(([, s]) => ['number', 'integer'].includes(settingKind(s) ?? ''))
      .map(([name, s]) => ({ name, label: label(s, name), unit: typeof s.unit === 'string' ? s.unit : '' }))
    return { key: p.key, name: p.name, settings }
  }))
  // What a field is called on the screen, a setting of one unit included.
  function fieldLabel(key: string): { label: string, unit: string } {
    const f = searchFields.find(x => x.key === key)
    if (f) return { label: f.label, unit: f.unit }
    const m = UNIT_SETTING.exec(key)
    const unit = m ? units.value.find(u => u.key === m[1]) : undefined
    const setting = unit?.settings.find(s => s.name === m![2])
    return setting ? { label: `${setting.label} on the ${unit!.name}`, unit: setting.unit } : { label: 'A setting of one drive unit', unit: '' }
  }
  return { units, fieldLabel }
}
