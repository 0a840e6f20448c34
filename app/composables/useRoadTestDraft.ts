import type { CheckDraft } from '~/components/road-test/RoadTestCheckStep.vue'
import type { ExtraCheckDraft } from '~/components/road-test/RoadTestExtraChecksStep.vue'

// The road test being entered, kept on the phone as it goes (localStorage), so a reload, a closed tab or a
// lost signal loses nothing. Its send key is made when the record is begun and goes with every send, so the
// server records it once however often it is sent. Photos are kept in IndexedDB (app/utils/kept-photos.ts) and
// the draft names them; it is forgotten once the record and every photo have reached the server. Drafts are
// kept per person, so the next person on a shared phone neither sees nor sends another's road test. The
// workshop's own checks are kept beside the six drive checks.
export interface RoadTestDraftState {
  idempotencyKey: string
  conditions: { surface: string, ambientC: number | null, route: string }
  checks: CheckDraft[]
  extras: ExtraCheckDraft[]
  verdict: string
  // The tick under the pre-drive cautions: the record cannot be sent without it.
  preDriveConfirmed: boolean
  step: number
  // Sent and not yet answered, or waiting for the connection: sent again when the page can.
  unsent: boolean
  // The record the server made of it, while photos taken for it still wait to be sent.
  recordId: number | null
}

export const roadTestDraftKey = (owner: number, versionId: number) => `voltwright:road-test:${owner}:${versionId}`

const freshExtra = (key: string): ExtraCheckDraft => ({ key, verdict: '', value: null, note: '' })

export function freshRoadTestDraft(keys: readonly string[], extraKeys: readonly string[] = []): RoadTestDraftState {
  return {
    idempotencyKey: crypto.randomUUID(),
    conditions: { surface: '', ambientC: null, route: '' },
    checks: keys.map(key => ({ key, verdict: '', values: {}, note: '', photos: [] })),
    extras: extraKeys.map(freshExtra),
    verdict: '', preDriveConfirmed: false, step: 0, unsent: false, recordId: null
  }
}

// A kept draft's workshop checks, in the order the brief lists them now: one kept from before keeps what was
// entered, a check added since starts empty, one no longer asked for is dropped.
export function keptExtras(kept: unknown, extraKeys: readonly string[]): ExtraCheckDraft[] {
  const list = Array.isArray(kept) ? kept as Partial<ExtraCheckDraft>[] : []
  return extraKeys.map((key) => {
    const k = list.find(e => e?.key === key)
    return k ? { key, verdict: typeof k.verdict === 'string' ? k.verdict : '', value: typeof k.value === 'number' ? k.value : null, note: typeof k.note === 'string' ? k.note : '' } : freshExtra(key)
  })
}

export function useRoadTestDraft(owner: number, versionId: number, keys: readonly string[], extraKeys: readonly string[] = []) {
  const storageKey = () => roadTestDraftKey(owner, versionId)
  const draft = ref<RoadTestDraftState>(freshRoadTestDraft(keys, extraKeys))
  const restored = ref(false)
  let stopKeeping = () => {}
  onMounted(() => {
    try {
      const kept = JSON.parse(localStorage.getItem(storageKey()) ?? 'null') as RoadTestDraftState | null
      if (kept?.idempotencyKey) {
        // A photo that lived in the closed page only is gone; the ones in IndexedDB are still named.
        draft.value = {
          ...draft.value, ...kept, recordId: kept.recordId ?? null,
          checks: kept.checks.map(c => ({ ...c, photos: (c.photos ?? []).filter(p => p.kept) })),
          extras: keptExtras(kept.extras, extraKeys)
        }
        restored.value = true
      }
    } catch { /* a draft that does not read is started afresh */ }
    stopKeeping = watch(draft, (d) => {
      localStorage.setItem(storageKey(), JSON.stringify(d))
    }, { deep: true, immediate: true })
    void dropStrayPhotos(owner, versionId, draft.value.idempotencyKey)
  })
  // Once the server has the record the phone keeps nothing of it, and writes no more.
  const forget = () => {
    stopKeeping()
    localStorage.removeItem(storageKey())
  }
  return { draft, restored, forget }
}

// A send that did not reach the server, or whose answer did not come back: worth sending again.
export function lostInTransit(err: unknown): boolean {
  const e = err as { response?: unknown, statusCode?: number, name?: string }
  return e?.name === 'FetchError' && e.response === undefined && e.statusCode === undefined
}
