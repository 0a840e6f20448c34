import type { SettingValues } from '~~/shared/compute/parameter-input'
import type { VersionDiff, VersionView } from '~~/shared/schemas/profile-views'

export interface DraftChanges { lockVersion: number, parameters?: SettingValues, rationale?: string }

// One version (the tune sheet) and what its author and reviewers can do with it.
export function useVersion(id: MaybeRefOrGetter<number>) {
  const data = useFetch<VersionView>(() => `/api/versions/${toValue(id)}`, { key: () => cacheKeys.version(toValue(id)) })
  // A write answers the version as it now is: shown as it is, and the lists that hold it read again.
  async function took(v: VersionView) {
    data.data.value = v
    // A kit's baseline version has no car: its kit's page and the worklists are what hold it.
    if (v.vehicle) await carChanged(v.vehicle.id, cacheKeys.profiles(v.vehicle.id), cacheKeys.reviews, cacheKeys.drafts, cacheKeys.awaitingRoadTests)
    else await refreshNuxtData([cacheKeys.reviews, cacheKeys.drafts, `kit-${v.kit?.id}`])
    return v
  }
  const act = async (path: string, body: Record<string, unknown> = {}) => took(await $fetch<VersionView>(`/api/versions/${toValue(id)}/${path}`, { method: 'POST', body }))

  async function save(changes: DraftChanges) {
    return took(await $fetch<VersionView>(`/api/versions/${toValue(id)}`, { method: 'PATCH', body: changes }))
  }

  // A new draft that starts from this version (any version can be the starting point).
  async function startFrom() {
    return $fetch<VersionView>(`/api/profiles/${data.data.value!.profileId}/versions`, { method: 'POST', body: { fromVersionId: toValue(id) } })
  }

  return {
    ...data,
    // Awaited by a page that needs the version in its setup (the server renders the draft's settings).
    ready: Promise.resolve(data).then(() => undefined),
    save,
    startFrom,
    submit: (justifications: Record<string, string>) => act('submit', { justifications }),
    withdraw: () => act('withdraw'),
    approve: (comment: string) => act('approve', { comment }),
    reject: (comment: string) => act('reject', { comment })
  }
}

export function useVersionDiff(a: MaybeRefOrGetter<number>, b: MaybeRefOrGetter<number>) {
  return useFetch<VersionDiff>(() => `/api/versions/${toValue(a)}/diff/${toValue(b)}`, { key: () => cacheKeys.diff(toValue(a), toValue(b)) })
}
