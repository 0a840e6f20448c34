export interface PlatformView { id: number, key: string, name: string, motorMaxRpm: number, schema: Record<string, unknown> }

export function usePlatforms() {
  return useFetch<{ items: PlatformView[], total: number }>('/api/platforms', { key: 'platforms' })
}
