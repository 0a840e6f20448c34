import type { ProfileView, VersionView } from '~~/shared/schemas/profile-views'

// A car's tuning profiles with their versions; starting a profile or a version opens the new draft.
export function useVehicleProfiles(vehicleId: MaybeRefOrGetter<number>) {
  const data = useFetch<{ items: ProfileView[], total: number }>(() => `/api/vehicles/${toValue(vehicleId)}/profiles`, { key: () => cacheKeys.profiles(toValue(vehicleId)) })

  async function startProfile(name: string) {
    const v = await $fetch<VersionView>(`/api/vehicles/${toValue(vehicleId)}/profiles`, { method: 'POST', body: { name } })
    await Promise.all([data.refresh(), carChanged(toValue(vehicleId), cacheKeys.drafts)])
    return v
  }

  async function startVersion(profileId: number, fromVersionId: number) {
    const v = await $fetch<VersionView>(`/api/profiles/${profileId}/versions`, { method: 'POST', body: { fromVersionId } })
    await Promise.all([data.refresh(), carChanged(toValue(vehicleId), cacheKeys.drafts)])
    return v
  }

  return { ...data, startProfile, startVersion }
}
