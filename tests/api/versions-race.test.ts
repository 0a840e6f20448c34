import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { newCar, newProfile } from './version-fixtures'

const TIMES = 20
const count = (statuses: number[], s: number) => statuses.filter(x => x === s).length

describe('versions under concurrency, and the database\'s own refusals', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const car = await newCar(tuner)
  const actions = (versionId: number, action: string) => withDatabase(async c => Number((await c.query('SELECT count(*) FROM audit_events WHERE "entityType" = $1 AND "entityId" = $2 AND action = $3', ['version', String(versionId), action])).rows[0].count))

  it(`${TIMES} simultaneous submits of one draft: exactly one succeeds, the rest hear 409`, async () => {
    const v = await newProfile(tuner, car.id)
    const statuses = (await Promise.all(Array.from({ length: TIMES }, () => tuner.call('POST', `/api/versions/${v.id}/submit`, {})))).map(r => r.status)
    expect(count(statuses, 200)).toBe(1)
    expect(count(statuses, 409)).toBe(TIMES - 1)
    expect(await actions(v.id, 'version.submitted')).toBe(1)
    const mail = await withDatabase(async c => Number((await c.query('SELECT count(*) FROM mail_outbox WHERE text LIKE $1', [`%/versions/${v.id}\n%`])).rows[0].count))
    const engineers = await withDatabase(async c => Number((await c.query(`SELECT count(*) FROM users u JOIN users t ON t.email = 'tuner@voltwright.test' WHERE u."workshopId" = t."workshopId" AND u.active AND 'engineer' = ANY(u.roles)`)).rows[0].count))
    expect(mail).toBe(engineers)
  })

  it(`${TIMES} simultaneous approvals of one version: exactly one review, one event, one success`, async () => {
    const v = await newProfile(tuner, car.id)
    expect((await tuner.call('POST', `/api/versions/${v.id}/submit`, {})).status).toBe(200)
    const answers = await Promise.all(Array.from({ length: TIMES }, () => engineer.call('POST', `/api/versions/${v.id}/approve`, { comment: 'Fine' })))
    const statuses = answers.map(r => r.status)
    expect(count(statuses, 200)).toBe(1)
    expect(count(statuses, 409)).toBe(TIMES - 1)
    expect(answers.filter(a => a.status === 409).every(a => a.body.data.state === 'approved')).toBe(true)
    const reviews = await withDatabase(c => c.query('SELECT decision FROM reviews WHERE "versionId" = $1', [v.id]))
    expect(reviews.rows).toEqual([{ decision: 'approve' }])
    expect(await actions(v.id, 'version.approved')).toBe(1)
  })

  it(`${TIMES} simultaneous new versions of one profile are numbered 1..${TIMES + 1}, no gap, no duplicate`, async () => {
    const v1 = await newProfile(tuner, car.id)
    const answers = await Promise.all(Array.from({ length: TIMES }, (_, i) => tuner.call('POST', `/api/profiles/${v1.profileId}/versions`, { fromVersionId: v1.id, rationale: `attempt ${i}` })))
    expect(answers.map(a => a.status)).toEqual(Array(TIMES).fill(201))
    const numbers = await withDatabase(c => c.query('SELECT "versionNo" FROM profile_versions WHERE "profileId" = $1 ORDER BY "versionNo"', [v1.profileId]))
    expect(numbers.rows.map(r => r.versionNo)).toEqual(Array.from({ length: TIMES + 1 }, (_, i) => i + 1))
  })

  it('the database itself refuses to change a submitted version\'s content, to delete a version, or to skip a number', async () => {
    const v = await newProfile(tuner, car.id)
    await tuner.call('POST', `/api/versions/${v.id}/submit`, {})
    // As the application's own database role, the one the server connects with.
    await withDatabase(async (c) => {
      await expect(c.query(`UPDATE profile_versions SET parameters = jsonb_set(parameters, '{powerCapKw}', '44') WHERE id = $1`, [v.id])).rejects.toThrow(/cannot change/)
      await expect(c.query('UPDATE profile_versions SET rationale = $2 WHERE id = $1', [v.id, 'rewritten'])).rejects.toThrow(/cannot change/)
      await expect(c.query('UPDATE profile_versions SET evaluation = NULL WHERE id = $1', [v.id])).rejects.toThrow(/cannot change/)
      await expect(c.query('DELETE FROM profile_versions WHERE id = $1', [v.id])).rejects.toThrow(/never deleted/)
      const row = await c.query('SELECT "workshopId", "authorId", "contentHash" FROM profile_versions WHERE id = $1', [v.id])
      const { workshopId, authorId, contentHash } = row.rows[0]
      await expect(c.query(`INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, "authorId", "contentHash") VALUES ($1, $2, 3, '{}', $3, $4)`, [workshopId, v.profileId, authorId, contentHash])).rejects.toThrow(/gap or a duplicate/)
      await expect(c.query(`INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, "authorId", "contentHash") VALUES ($1, $2, 1, '{}', $3, $4)`, [workshopId, v.profileId, authorId, contentHash])).rejects.toThrow(/gap or a duplicate/)
      const after = await c.query('SELECT parameters, rationale FROM profile_versions WHERE id = $1', [v.id])
      expect(after.rows[0].parameters).toEqual(v.parameters)
    })
    // The state can still move on (the review is not content).
    expect((await engineer.call('POST', `/api/versions/${v.id}/approve`, {})).status).toBe(200)
  })
})
