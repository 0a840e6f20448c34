import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn } from './helpers'
import { submitAndApprove } from './version-fixtures'
import { bookIn, carProfile, newKit } from './kit-fixtures'

describe('a car moving onto its kit\'s newer baseline', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const engineer = await signIn('engineer@voltwright.test')
  const kit = await newKit(tuner)
  const v1 = kit.versions[0]!
  await submitAndApprove(tuner, engineer, v1.id)
  const car = (await bookIn(tuner, kit.id)).body
  const draft = (await carProfile(tuner, car.id)).versions[0]
  const loaded = (await tuner.call('GET', `/api/versions/${draft.id}`)).body
  // The car's own deviations: power cap (the baseline will change it too) and creep (the baseline will not).
  const carParams = { ...loaded.parameters, powerCapKw: 35, creepTorqueNm: loaded.parameters.creepTorqueNm + 5 }
  await tuner.call('PATCH', `/api/versions/${draft.id}`, { lockVersion: loaded.lockVersion, parameters: carParams })
  const base = (await tuner.call('GET', `/api/versions/${v1.id}`)).body.parameters
  const v2 = (await tuner.call('POST', `/api/profiles/${kit.baselineProfileId}/versions`, { parameters: { ...base, powerCapKw: 38, liftOffRegenPct: 15 }, rationale: 'Less lift-off regen for winter' })).body
  const profileId = draft.profileId

  it('does not say the baseline moved until the newer baseline is approved', async () => {
    expect((await carProfile(tuner, car.id)).baseline.moved).toBeNull()
    expect((await tuner.call('POST', `/api/profiles/${profileId}/rebase`, {})).status).toBe(409)
    await submitAndApprove(tuner, engineer, v2.id)
    expect((await carProfile(tuner, car.id)).baseline.moved).toEqual({ versionId: v2.id, versionNo: 2 })
  })

  it('previews three ways: the car\'s deviations kept, the baseline\'s changes taken, both-changed shown as a conflict', async () => {
    const res = await engineer.call('GET', `/api/profiles/${profileId}/rebase`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ moved: true, from: { id: v1.id }, to: { id: v2.id }, conflicts: ['powerCapKw'] })
    const row = (n: string) => res.body.rows.find((r: { name: string }) => r.name === n)
    expect(row('powerCapKw')).toMatchObject({ base: 40, car: 35, kit: 38, merged: null, conflict: true, unit: 'kW' })
    expect(row('liftOffRegenPct')).toMatchObject({ base: 20, car: 20, kit: 15, merged: 15, source: 'kit' })
    expect(row('creepTorqueNm')).toMatchObject({ merged: carParams.creepTorqueNm, source: 'car' })
  })

  it('refuses to rebase with a conflict left unchosen, then starts a new draft on the newer baseline', async () => {
    const refused = await tuner.call('POST', `/api/profiles/${profileId}/rebase`, {})
    expect(refused.status).toBe(409)
    expect(refused.body.data.conflicts).toEqual(['powerCapKw'])
    expect((await tuner.call('POST', `/api/profiles/${profileId}/rebase`, { choices: { powerCapKw: 'sideways' } })).status).toBe(400)
    const res = await tuner.call('POST', `/api/profiles/${profileId}/rebase`, { choices: { powerCapKw: 'car' } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body).toMatchObject({ state: 'draft', parentVersionId: draft.id, baselineVersionId: v2.id })
    expect(res.body.parameters).toEqual({ ...carParams, powerCapKw: 35, liftOffRegenPct: 15 })
    const after = await carProfile(tuner, car.id)
    expect(after.baseline).toMatchObject({ versionId: v2.id, moved: null, currentVersionId: res.body.id })
    expect(after.baseline.differs).toEqual(['creepTorqueNm', 'powerCapKw'])
    expect((await tuner.call('POST', `/api/profiles/${profileId}/rebase`, {})).status).toBe(409)
  })
})
