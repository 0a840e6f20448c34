import type { Ref } from 'vue'
import { checkGuides } from '~~/shared/schemas/road-test-checks'
import type { RoadTestView } from '~~/shared/schemas/road-test-views'
import type { RoadTestDraftState } from './useRoadTestDraft'
import { dropPhoto, keepPhoto, readPhoto, sha256Hex } from '~/utils/kept-photos'

// The road test's photos: kept on the phone as they are taken, sent one by one after the record, each
// forgotten once the server has it. A send whose answer was lost is not repeated: the record's photos are read
// first and a photo already there (same SHA-256) is only forgotten (docs/road-tests.md#no-signal).
export function useRoadTestPhotos(draft: Ref<RoadTestDraftState>, owner: number, versionId: number) {
  const waiting = computed(() => draft.value.checks.reduce((n, c) => n + c.photos.length, 0))

  async function add(index: number, files: File[]) {
    for (const file of files) {
      const ref = await keepPhoto({ owner, versionId, sendKey: draft.value.idempotencyKey, name: file.name, type: file.type, blob: file })
      draft.value.checks[index]!.photos.push(ref)
    }
  }

  async function remove(index: number, id: string) {
    const check = draft.value.checks[index]!
    check.photos = check.photos.filter(p => p.id !== id)
    await dropPhoto(id)
  }

  // Photos of a send that may have arrived: what the record already holds, by SHA-256.
  async function alreadyThere(recordId: number): Promise<Set<string>> {
    if (!draft.value.checks.some(c => c.photos.some(p => p.tried))) return new Set()
    const record = await $fetch<RoadTestView>(`/api/road-tests/${recordId}`)
    return new Set(record.photos.map(p => p.sha256))
  }

  // Sends what waits to the record made with this draft's send key. `done` is false when the connection went:
  // the rest stay on the phone for the next try. A photo the server refuses is said, and not kept.
  async function send(recordId: number, say: (what: string) => void): Promise<{ done: boolean, refused: string[] }> {
    const refused: string[] = []
    let there: Set<string>
    try {
      there = await alreadyThere(recordId)
    } catch {
      return { done: false, refused }
    }
    for (const [i, check] of draft.value.checks.entries()) {
      const title = checkGuides[i]!.title
      for (const ref of [...check.photos]) {
        const kept = await readPhoto(ref.id)
        // Only this record's photos: taken by this person, for this version, under this send key.
        if (!kept || kept.owner !== owner || kept.versionId !== versionId || kept.sendKey !== draft.value.idempotencyKey) {
          if (kept) refused.push(`${ref.name} (${title}): it was taken for another road test, so it was not sent.`)
          await remove(i, ref.id)
          continue
        }
        if (!there.has(await sha256Hex(kept.blob))) {
          if (!navigator.onLine) return { done: false, refused }
          say(`Sending photos (${title})…`)
          ref.tried = true
          const file = new File([kept.blob], kept.name, { type: kept.type })
          const answer = await uploadWithProgress(`/api/road-tests/${recordId}/photos?caption=${encodeURIComponent(title)}`, file, () => {}).catch(() => null)
          // Lost on the way, or a server that could not take it just now: it waits for the next try.
          if (!answer || answer.status === 0 || answer.status >= 500) return { done: false, refused }
          if (answer.status >= 300) refused.push(`${ref.name} (${title}): ${answer.body.message ?? `the server answered ${answer.status}`}`)
        }
        await remove(i, ref.id)
      }
    }
    return { done: true, refused }
  }

  return { waiting, add, remove, send }
}
