import type { RecheckView } from '~~/shared/schemas/fleet'

// The latest re-check of the workshop's cars, read again every two seconds while it runs.
export function useRecheck() {
  const data = useFetch<RecheckView>('/api/fleet/recheck', { key: 'fleet-recheck' })
  let timer: ReturnType<typeof setInterval> | undefined
  onMounted(() => { timer = setInterval(() => { if (data.data.value?.state === 'running') data.refresh() }, 2000) })
  onBeforeUnmount(() => clearInterval(timer))
  async function recheckNow() {
    await $fetch('/api/fleet/recheck', { method: 'POST', body: {} })
    await data.refresh()
  }
  return { ...data, recheckNow }
}
