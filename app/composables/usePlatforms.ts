import type { PlatformUpload } from '~~/shared/schemas/platform'

export interface PlatformView { id: number, key: string, name: string, motorMaxRpm: number, schema: Record<string, unknown>, shared: boolean }

export function usePlatforms() {
  const list = useFetch<{ items: PlatformView[], total: number }>('/api/platforms', { key: cacheKeys.platforms })
  async function upload(input: PlatformUpload) {
    const created = await $fetch<PlatformView>('/api/platforms', { method: 'POST', body: input })
    if (list.data.value) list.data.value = { items: [...list.data.value.items, created], total: list.data.value.total + 1 }
    return created
  }
  return { ...list, upload }
}

export function usePlatform(key: MaybeRefOrGetter<string | null | undefined>) {
  return useFetch<PlatformView>(() => `/api/platforms/${encodeURIComponent(toValue(key) ?? '')}`, {
    key: () => cacheKeys.platform(toValue(key)),
    immediate: Boolean(toValue(key)),
    watch: [() => toValue(key)]
  })
}
