// The names the history shows in place of record numbers: a version as "Road v12", a person, a snag's title,
// each as it was when the event was written (names-then.ts). Looked up once per page, a query per kind of
// record, all scoped to the workshop.
import { QueryTypes } from 'sequelize'
import type { EventNames } from '../../../shared/schemas/history'
import { isPatch } from '../../../shared/utils/audit-changes'
import { useDatabase } from '../database/db'
import { personTimeline, snagTimeline } from './names-then'
import { nameAt } from './name-timeline'

export interface NamedRow { id: string, action: string, entityType: string, entityId: string, data: Record<string, unknown> }

const idOf = (x: unknown) => (typeof x === 'number' || (typeof x === 'string' && /^\d{1,10}$/.test(x)) ? Number(x) : null)
const PEOPLE_PATHS = new Set(['/assigneeId', '/ownerUserId'])

// The person numbers a row's values name (a snag's assignee, a car's owner).
function peopleIn(r: NamedRow): number[] {
  const ids: unknown[] = []
  if (isPatch(r.data.patch)) ids.push(...r.data.patch.filter(o => PEOPLE_PATHS.has(o.path)).map(o => o.value))
  for (const snap of [r.data.after, r.data.before]) {
    if (snap && typeof snap === 'object') ids.push((snap as Record<string, unknown>).assigneeId, (snap as Record<string, unknown>).ownerUserId)
  }
  return ids.map(idOf).filter((x): x is number => x !== null)
}

export async function eventNames(workshopId: number, rows: NamedRow[]): Promise<EventNames[]> {
  const db = useDatabase()
  const select = async <T>(sql: string, ids: Set<number>) => ids.size
    ? db.query<T & { id: number }>(sql, { replacements: { workshopId, ids: [...ids] }, type: QueryTypes.SELECT })
    : []
  const roadTestIds = new Set<number>()
  const versionIds = new Set<number>()
  const userIds = new Set<number>()
  const snagIds = new Set<number>()
  for (const r of rows) {
    const own = idOf(r.entityId)
    if (own !== null) ({ 'version': versionIds, 'road-test': roadTestIds, 'user': userIds, 'snag': snagIds } as Record<string, Set<number>>)[r.entityType]?.add(own)
    for (const k of ['versionId', 'parentVersionId', 'supersededVersionId']) { const id = idOf(r.data[k]); if (id !== null) versionIds.add(id) }
    const rt = idOf(r.data.roadTestId)
    if (rt !== null) roadTestIds.add(rt)
    peopleIn(r).forEach(id => userIds.add(id))
  }
  const tests = await select<{ versionId: number }>('SELECT id, "versionId" FROM road_tests WHERE "workshopId" = :workshopId AND id IN (:ids)', roadTestIds)
  const testVersion = new Map(tests.map(t => [t.id, t.versionId]))
  tests.forEach(t => versionIds.add(t.versionId))
  const [versions, people, renames, titles] = await Promise.all([
    select<{ label: string }>(`SELECT pv.id, p.name || ' v' || pv."versionNo" AS label FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId"
      WHERE pv."workshopId" = :workshopId AND pv.id IN (:ids)`, versionIds),
    select<{ name: string }>('SELECT id, name FROM users WHERE "workshopId" = :workshopId AND id IN (:ids)', userIds),
    personTimeline(workshopId, userIds),
    snagTimeline(workshopId, snagIds, rows.reduce((m, r) => (BigInt(r.id) > m ? BigInt(r.id) : m), 0n))
  ])
  const versionName = new Map(versions.map(v => [v.id, v.label]))
  const personName = new Map(people.map(p => [p.id, p.name]))
  const versionOf = (id: number | null) => (id === null ? undefined : versionName.get(id))
  return rows.map((r) => {
    const own = idOf(r.entityId)
    const testId = r.entityType === 'road-test' ? own : idOf(r.data.roadTestId)
    const version = r.entityType === 'version' ? versionOf(own) : versionOf(idOf(r.data.versionId)) ?? versionOf(testId === null ? null : testVersion.get(testId) ?? null)
    const at = BigInt(r.id)
    const personThen = (id: number) => nameAt(renames, id, at, personName.get(id))
    const names: EventNames = { people: Object.fromEntries(peopleIn(r).flatMap(id => (personThen(id) ? [[String(id), personThen(id)!]] : []))) }
    if (version) names.version = version
    const parent = versionOf(idOf(r.data.parentVersionId))
    if (parent) names.parentVersion = parent
    const superseded = versionOf(idOf(r.data.supersededVersionId))
    if (superseded) names.supersededVersion = superseded
    const person = r.entityType === 'user' && own !== null ? personThen(own) : undefined
    if (person) names.person = person
    const snag = r.entityType === 'snag' && own !== null ? nameAt(titles, own, at, undefined) : undefined
    if (snag) names.snag = snag
    return names
  })
}
