import type { KitSummary, KitView, RebasePreview } from '~~/shared/schemas/kit'
import type { VersionView } from '~~/shared/schemas/profile-views'

export function useKits() {
  return useFetch<{ items: KitSummary[], total: number }>('/api/kits', { key: 'kits' })
}

export function useKit(id: MaybeRefOrGetter<number>) {
  const data = useFetch<KitView>(() => `/api/kits/${toValue(id)}`, { key: () => `kit-${toValue(id)}` })
  async function startBaselineVersion(fromVersionId?: number) {
    return $fetch<VersionView>(`/api/profiles/${data.data.value!.baselineProfileId}/versions`, { method: 'POST', body: fromVersionId ? { fromVersionId } : {} })
  }
  return { ...data, startBaselineVersion }
}

// What moving a car profile onto the kit's newer baseline would give, and doing it with the tuner's choices.
export function useRebase(profileId: MaybeRefOrGetter<number>) {
  const data = useFetch<RebasePreview>(() => `/api/profiles/${toValue(profileId)}/rebase`, { key: () => `rebase-${toValue(profileId)}` })
  async function rebase(choices: Record<string, 'car' | 'kit'>) {
    return $fetch<VersionView>(`/api/profiles/${toValue(profileId)}/rebase`, { method: 'POST', body: { choices } })
  }
  return { ...data, rebase }
}
