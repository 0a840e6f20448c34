import type { HandoverSheet } from '~~/shared/schemas/handover'

export function useHandover(vehicleId: MaybeRefOrGetter<number>) {
  return useFetch<HandoverSheet>(() => `/api/vehicles/${toValue(vehicleId)}/handover`, { key: () => cacheKeys.handover(toValue(vehicleId)) })
}
