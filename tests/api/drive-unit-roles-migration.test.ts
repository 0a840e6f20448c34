import { describe, expect, it } from 'vitest'
import { addRolesSql, removeRolesSql } from '../../migrations/20261203-4001-drive-unit-roles'
import { signIn, useRunningServer, withDatabase, type Caller } from './helpers'

// Every event of a car's history, as the history screen folds it (changes with their before-values), page by page.
async function foldHistory(c: Caller, vehicleId: number): Promise<unknown[]> {
  const items: unknown[] = []
  let cursor: string | null = null
  do {
    const res = await c.call('GET', `/api/vehicles/${vehicleId}/history?limit=100${cursor ? `&cursor=${cursor}` : ''}`)
    expect(res.status).toBe(200)
    items.push(...res.body.items)
    cursor = res.body.nextCursor
  } while (cursor)
  return items
}

async function foldEverything(c: Caller, vehicleIds: number[]) {
  const out: Record<number, unknown> = {}
  for (const id of vehicleIds) out[id] = await foldHistory(c, id)
  const versions = await withDatabase(db => db.query('SELECT id, parameters, "contentHash" FROM profile_versions ORDER BY id'))
  return { histories: out, versions: versions.rows }
}

describe('the migration that gives drive units their roles', async () => {
  await useRunningServer()
  const auditor = await signIn('auditor@voltwright.test')

  it('loses nothing: every demo car\'s history and every version fold the same with and without the roles, and the schemas come back as they were', async () => {
    const cars = await withDatabase(db => db.query('SELECT v.id FROM vehicles v JOIN workshops w ON w.id = v."workshopId" WHERE w.name = $1 ORDER BY v.id', ['Old Forge Electric Works']))
    const ids = cars.rows.map(r => r.id as number)
    expect(ids.length).toBeGreaterThanOrEqual(6)
    const schemasBefore = await withDatabase(db => db.query('SELECT id, schema FROM platforms ORDER BY id'))
    const after = await foldEverything(auditor, ids)
    let before: Awaited<ReturnType<typeof foldEverything>>
    try {
      await withDatabase(async (db) => { for (const sql of removeRolesSql()) await db.query(sql) }, true)
      const bare = await withDatabase(db => db.query(`SELECT count(*)::int AS n FROM platforms WHERE key IN ('fenlow-45', 'marrick-110', 'ulvane-220') AND schema::text LIKE '%x-role%'`))
      expect(bare.rows[0].n).toBe(0)
      before = await foldEverything(auditor, ids)
    } finally {
      await withDatabase(async (db) => { for (const sql of addRolesSql()) await db.query(sql) }, true)
    }
    expect(after.histories).toEqual(before.histories)
    expect(after.versions).toEqual(before.versions)
    expect(Object.values(after.histories).flat().length).toBeGreaterThan(20)
    const schemasAfter = await withDatabase(db => db.query('SELECT id, schema FROM platforms ORDER BY id'))
    expect(schemasAfter.rows).toEqual(schemasBefore.rows)
    expect((await auditor.call('GET', '/api/audit/verify')).body.ok).toBe(true)
  })
})
