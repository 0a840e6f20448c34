import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { expectedContentHash } from './version-fixtures'

// The seeded profiles match each demo car's stage, hash as docs/architecture.md#version-hash says, and have their history.
describe('the demo workshop\'s profiles', async () => {
  await useRunningServer()
  const engineer = await signIn('engineer@voltwright.test')
  const cars = (await engineer.call('GET', '/api/vehicles?pageSize=100')).body.items as { id: number, stockRef: string }[]
  const profilesOf = async (ref: string) => (await engineer.call('GET', `/api/vehicles/${cars.find(c => c.stockRef === ref)!.id}/profiles`)).body.items
  const states = (p: { versions: { versionNo: number, state: string }[] }) => p.versions.map(v => [v.versionNo, v.state])

  it('fits each car\'s stage: approved awaiting road test, signed off on handed-over and snagging cars, a draft on a converting car', async () => {
    const road101 = (await profilesOf('OF-101')).find((p: { name: string }) => p.name === 'Road')
    expect(states(road101)).toEqual(expect.arrayContaining([[2, 'approved'], [1, 'rejected']]))
    expect(road101.versions.find((v: { state: string }) => v.state === 'rejected').lastReview.comment).toMatch(/lift-off/i)
    for (const ref of ['OF-103', 'OF-104']) {
      const profiles = await profilesOf(ref)
      for (const p of profiles.filter((x: { onCarVersionId: number | null }) => x.onCarVersionId)) {
        expect(p.versions.find((v: { id: number }) => v.id === p.onCarVersionId).state, ref).toBe('signed-off')
      }
      expect(profiles.some((p: { onCarVersionId: number | null }) => p.onCarVersionId), ref).toBe(true)
    }
    expect((await profilesOf('OF-102')).flatMap((p: { versions: { state: string }[] }) => p.versions.map(v => v.state))).toContain('draft')
    expect(await profilesOf('OF-105')).toEqual([])
  })

  it('holds valid content hashes, justified dangers, and an audit event for every step', async () => {
    const ids = await withDatabase(c => c.query(`SELECT pv.id FROM profile_versions pv JOIN vehicles v ON v.id = (SELECT "vehicleId" FROM profiles WHERE id = pv."profileId") WHERE v."stockRef" LIKE 'OF-1%' ORDER BY pv.id`))
    expect(ids.rows.length).toBeGreaterThanOrEqual(8)
    for (const { id } of ids.rows) {
      const v = (await engineer.call('GET', `/api/versions/${id}`)).body
      expect(v.contentHash, `version ${id}`).toBe(expectedContentHash(v))
      const actions = v.history.map((e: { action: string }) => e.action)
      expect(actions[0]).toBe('version.created')
      if (v.state !== 'draft') expect(actions).toContain('version.submitted')
      if (v.evaluation) for (const w of v.evaluation.warnings.filter((x: { severity: string }) => x.severity === 'danger')) expect(v.justifications[w.rule], `${id} ${w.rule}`).toBeTruthy()
      for (const r of v.reviews) expect(actions).toContain(r.decision === 'approve' ? 'version.approved' : 'version.rejected')
    }
  })
})
