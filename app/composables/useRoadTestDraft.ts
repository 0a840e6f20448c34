import type { CheckDraft } from '~/components/road-test/RoadTestCheckStep.vue'

// The road test being entered, kept on the phone as it goes (localStorage), so a reload, a closed tab or a
// lost signal loses nothing. Its send key is made when the record is begun and goes with every send, so the
// server records it once however often it is sent. Photos stay in the page's memory only.
export interface RoadTestDraftState {
  idempotencyKey: string
  conditions: { surface: string, ambientC: number | null, route: string }
  checks: CheckDraft[]
  verdict: string
  step: number
  // Sent and not yet answered, or waiting for the connection: sent again when the page can.
  unsent: boolean
}

const storageKey = (versionId: number) => `voltwright:road-test:${versionId}`

export function freshRoadTestDraft(keys: readonly string[]): RoadTestDraftState {
  return {
    idempotencyKey: crypto.randomUUID(),
    conditions: { surface: '', ambientC: null, route: '' },
    checks: keys.map(key => ({ key, verdict: '', values: {}, note: '', photos: [] })),
    verdict: '', step: 0, unsent: false
  }
}

export function useRoadTestDraft(versionId: number, keys: readonly string[]) {
  const draft = ref<RoadTestDraftState>(freshRoadTestDraft(keys))
  const restored = ref(false)
  let stopKeeping = () => {}
  onMounted(() => {
    try {
      const kept = JSON.parse(localStorage.getItem(storageKey(versionId)) ?? 'null') as RoadTestDraftState | null
      if (kept?.idempotencyKey) {
        draft.value = { ...draft.value, ...kept, checks: kept.checks.map(c => ({ ...c, photos: [] })) }
        restored.value = true
      }
    } catch { /* a draft that does not read is started afresh */ }
    stopKeeping = watch(draft, (d) => {
      localStorage.setItem(storageKey(versionId), JSON.stringify({ ...d, checks: d.checks.map(c => ({ ...c, photos: [] })) }))
    }, { deep: true, immediate: true })
  })
  // Once the server has the record the phone keeps nothing of it, and writes no more.
  const forget = () => {
    stopKeeping()
    localStorage.removeItem(storageKey(versionId))
  }
  return { draft, restored, forget }
}

// A send that did not reach the server, or whose answer did not come back: worth sending again.
export function lostInTransit(err: unknown): boolean {
  const e = err as { response?: unknown, statusCode?: number, name?: string }
  return e?.name === 'FetchError' && e.response === undefined && e.statusCode === undefined
}
