// A record's names over time, for naming it in each event as it was then (names-then.ts): the event id from
// which each name held, oldest first, and for people the name before their first recorded rename.
export type NameTimeline = Map<number, { from: bigint, name: string, before?: string }[]>

// The name a record had at event `eventId`: the last one set at or before it, else the first rename's old
// name (a person renamed since), else the name today.
export function nameAt(timeline: NameTimeline, id: number, eventId: bigint, today: string | undefined): string | undefined {
  const names = timeline.get(id) ?? []
  const held = names.filter(n => n.from <= eventId).at(-1)
  return held?.name ?? names[0]?.before ?? today
}
