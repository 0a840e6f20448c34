import type { DraftWorkItem, ReviewWorkItem } from '~~/shared/schemas/profile-views'

// The Bench's lists: what awaits an engineer's review, and a tuner's drafts and sent-back versions.
export function useReviewWorklist() {
  return useFetch<{ items: ReviewWorkItem[], total: number }>('/api/worklist/reviews', { key: cacheKeys.reviews })
}

export function useDraftWorklist() {
  return useFetch<{ items: DraftWorkItem[], total: number }>('/api/worklist/drafts', { key: cacheKeys.drafts })
}
