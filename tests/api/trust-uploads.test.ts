// Uploads: a multipart body without a boundary is a 400 with a message, and file names arrive as UTF-8.
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, withDatabase } from './helpers'
import { approvedVersion, multipart, newCar, newProfile, recordRoadTest, upload } from './road-test-fixtures'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'

const car0 = { massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 1.2, brakeRegenDecelMs2: 2, packVoltageV: 350, creepSpeedKph: 5 }
const NAME = 'Prüfstand–Fahrt ✓.csv'

describe('upload edge cases', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner)
  const roadTestId = await recordRoadTest(tester, await approvedVersion(await newProfile(car.id)))
  const path = `/api/road-tests/${roadTestId}/telemetry`

  it('answers a multipart upload without a boundary with 400 and a message', async () => {
    const res = await upload(tester, path, 'file=x', { 'content-type': 'multipart/form-data' })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/boundary/)
  })

  it('keeps a file name written in UTF-8 intact, and offers it back for download', async () => {
    const res = await upload(tester, path, multipart(telemetryCsv(syntheticDrive(car0)), NAME, 'text/csv'))
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const stored = await withDatabase(async c => (await c.query('SELECT filename FROM attachments WHERE id = $1', [res.body.attachment.id])).rows[0].filename)
    expect(stored).toBe(NAME)
    const download = await fetch(`${process.env.VOLTWRIGHT_BASE_URL ?? 'http://localhost:3100'}/api/attachments/${res.body.attachment.id}`, { headers: { cookie: tester.cookie } })
    expect(download.status).toBe(200)
    expect(download.headers.get('content-disposition')).toContain(`filename*=UTF-8''${encodeURIComponent(NAME)}`)
  })
})
