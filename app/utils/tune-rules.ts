// The safety rules on the tune sheet: their titles (shared with the history) and their order.
export { ruleTitles } from '~~/shared/compute/rule-titles'

export const severityOrder = { danger: 0, caution: 1, info: 2 } as const
