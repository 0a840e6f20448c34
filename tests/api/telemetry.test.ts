import { describe, it, expect } from 'vitest'
import { S3Client, ListObjectsV2Command, GetObjectCommand } from '@aws-sdk/client-s3'
import { useRunningServer, signIn, withDatabase, baseUrl } from './helpers'
import { approvedVersion, multipart, newCar, newProfile, recordRoadTest, sha256, upload } from './road-test-fixtures'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'
import { summarise } from '../../shared/telemetry/summary'

const s3 = new S3Client({ endpoint: process.env.NUXT_S3_ENDPOINT, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }, requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED' })
async function storedKeys(): Promise<string[]> {
  const keys: string[] = []
  let token: string | undefined
  do {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: 'voltwright', Prefix: 'telemetry/', ContinuationToken: token }))
    keys.push(...(page.Contents ?? []).map(o => o.Key!))
    token = page.NextContinuationToken
  } while (token)
  return keys.sort()
}

const car0 = { massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 1.2, brakeRegenDecelMs2: 2, packVoltageV: 350, creepSpeedKph: 5 }
const header = 'time_s,speed_kph,motor_torque_nm,motor_rpm,pedal_pct,brake,motor_c,inverter_c,battery_c,battery_v,battery_a'

describe('telemetry upload', async () => {
  await useRunningServer()
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')
  const car = await newCar(tuner)
  const versionId = await approvedVersion(await newProfile(car.id))
  const roadTestId = await recordRoadTest(tester, versionId)
  const path = `/api/road-tests/${roadTestId}/telemetry`
  const rows = async () => withDatabase(async c => ({
    logs: Number((await c.query('SELECT count(*) FROM telemetry_logs WHERE "roadTestId" = $1', [roadTestId])).rows[0].count),
    files: Number((await c.query('SELECT count(*) FROM attachments WHERE "ownerType" = \'telemetry\' AND "ownerId" = $1', [roadTestId])).rows[0].count)
  }))

  // Every refusal must leave no object, no attachment row and no telemetry row behind.
  async function refusedLeavesNothing(send: () => Promise<{ status: number, body: any }>, status: number) {
    const [keysBefore, rowsBefore] = [await storedKeys(), await rows()]
    const res = await send()
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(status)
    expect(await rows()).toEqual(rowsBefore)
    expect(await storedKeys()).toEqual(keysBefore)
    return res
  }

  it('stores the log, answers its summary under the names of docs/computation.md#telemetry-summary, and the stored bytes come back equal', async () => {
    const samples = syntheticDrive(car0, { rollbackM: 0.12 })
    const csv = telemetryCsv(samples, '\r\n')
    const res = await upload(tester, path, multipart(csv, 'forge-loop.csv', 'text/csv'))
    expect(res.status).toBe(201)
    expect(Object.keys(res.body.summary).sort()).toEqual(['durationS', 'energyOutWh', 'energyRegenWh', 'maxRollbackM', 'peakBatteryC', 'peakInverterC', 'peakLiftOffDecelMs2', 'peakMotorC', 'peakPowerKw', 'peakSpeedKph', 'samples'].sort())
    const expected = summarise(samples)
    expect(res.body.summary.samples).toBe(samples.length)
    expect(res.body.summary.peakLiftOffDecelMs2).toBeCloseTo(1.2, 2)
    expect(res.body.summary.maxRollbackM).toBeCloseTo(0.12, 2)
    expect(res.body.summary.energyOutWh).toBeCloseTo(expected.energyOutWh, 0)
    expect(res.body.attachment.sha256).toBe(sha256(csv))
    expect(res.body.attachment.bytes).toBe(Buffer.byteLength(csv))
    // Round trip through the object store, by the API and straight from the store.
    const back = await fetch(`${baseUrl}/api/attachments/${res.body.attachment.id}`, { headers: { cookie: tester.cookie } })
    const bytes = Buffer.from(await back.arrayBuffer())
    expect(bytes.length).toBe(Buffer.byteLength(csv))
    expect(sha256(bytes)).toBe(sha256(csv))
    const key = await withDatabase(async c => (await c.query('SELECT "objectKey" FROM attachments WHERE id = $1', [res.body.attachment.id])).rows[0].objectKey)
    expect(key).toMatch(/^telemetry\/[0-9a-f-]{36}$/)
    const direct = await s3.send(new GetObjectCommand({ Bucket: 'voltwright', Key: key }))
    expect(sha256(Buffer.from(await direct.Body!.transformToByteArray()))).toBe(sha256(csv))
    expect((await fetch(`${baseUrl}/api/attachments/${res.body.attachment.id}`, { headers: { cookie: otherAdmin.cookie } })).status).toBe(404)
    const chart = await tester.call('GET', `/api/road-tests/${roadTestId}/chart`)
    expect(chart.body.series.timeS.length).toBeGreaterThan(100)
    expect(chart.body.series.timeS.length).toBeLessThanOrEqual(800)
    expect(chart.body.comparison.liftOffDecel.measuredMs2).toBeCloseTo(1.2, 2)
    expect(chart.body.comparison.liftOffDecel.predictedMs2).toBeGreaterThan(0)
    expect(chart.body.comparison.startGrade).toMatchObject({ testedPct: 18 })
    expect(chart.body.comparison.startGrade.predictedMaxPct).toBeGreaterThan(0)
  })

  it('streams a log larger than a part of the multipart upload (12 MB) intact', async () => {
    const csv = telemetryCsv(syntheticDrive(car0, { laps: 40, hz: 20 }))
    expect(Buffer.byteLength(csv)).toBeGreaterThan(9 * 1024 * 1024)
    const res = await upload(tester, path, multipart(csv, 'long.csv', 'text/csv'))
    expect(res.status).toBe(201)
    const back = await fetch(`${baseUrl}/api/attachments/${res.body.attachment.id}`, { headers: { cookie: tester.cookie } })
    expect(sha256(Buffer.from(await back.arrayBuffer()))).toBe(sha256(csv))
  })

  it('413 for a file over 50 MB, by its declared length and by its streamed length', async () => {
    const big = Buffer.alloc(51 * 1024 * 1024, '0,0,0,0,0,0,20,20,20,350,0\n')
    await refusedLeavesNothing(() => upload(tester, path, multipart(Buffer.concat([Buffer.from(`${header}\n`), big]), 'big.csv', 'text/csv')), 413)
    // Sent chunked, with no length up front, and every row good: the limit is found while streaming.
    const rows: string[] = [header]
    for (let i = 0; rows.length < 1_900_000; i++) rows.push(`${i / 100},12,30,900,20,0,40,35,25,350,20`)
    const good = Buffer.from(rows.join('\n'))
    expect(good.length).toBeGreaterThan(50 * 1024 * 1024)
    const form = multipart(good, 'big.csv', 'text/csv')
    const encoded = new Response(form)
    const stream = encoded.body!
    const res = await refusedLeavesNothing(async () => {
      const r = await fetch(`${baseUrl}${path}`, { method: 'POST', headers: { 'cookie': tester.cookie, 'content-type': encoded.headers.get('content-type')! }, body: stream, duplex: 'half' } as RequestInit)
      return { status: r.status, body: await r.json() }
    }, 413)
    expect(res.body.message).toContain('50 MB')
  }, 180_000) // the server reads 50 MB of good rows before it finds the file too large

  it('415 for a file that is not CSV, by its type or by its content, and for a body that is not multipart', async () => {
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex')
    await refusedLeavesNothing(() => upload(tester, path, multipart(png, 'photo.png', 'image/png')), 415)
    await refusedLeavesNothing(() => upload(tester, path, multipart(png, 'log.csv', 'text/csv')), 415)
    await refusedLeavesNothing(() => upload(tester, path, `${header}\n0,0,0,0,0,0,20,20,20,350,0\n`, { 'content-type': 'text/csv' }), 415)
  })

  it('422 naming the row and the column of a bad row, half-way through a long file', async () => {
    const lines = telemetryCsv(syntheticDrive(car0)).trimEnd().split('\n')
    lines[2001] = lines[2001]!.replace(/^([^,]*,[^,]*,[^,]*,[^,]*),[^,]*/, '$1,lots')
    const res = await refusedLeavesNothing(() => upload(tester, path, multipart(lines.join('\n'), 'bad.csv', 'text/csv')), 422)
    expect(res.body.data).toEqual({ row: 2001, line: 2002, column: 'pedal_pct' })
    expect(res.body.message).toContain('Row 2001 (line 2002), column pedal_pct')
    const noColumn = await refusedLeavesNothing(() => upload(tester, path, multipart(`${header.replace(',brake', '')}\n0,0,0,0,0,20,20,20,350,0\n`, 'old.csv', 'text/csv')), 422)
    expect(noColumn.body.data).toEqual({ row: 0, line: 1, column: 'brake' })
  })

  it('400 without a file, 403 for a tuner and for another workshop\'s manager', async () => {
    const form = new FormData()
    form.append('note', 'no file')
    expect((await upload(tester, path, form)).status).toBe(400)
    expect((await upload(tuner, path, multipart(`${header}\n`, 'a.csv', 'text/csv'))).status).toBe(403)
    expect((await upload(otherAdmin, path, multipart(`${header}\n`, 'a.csv', 'text/csv'))).status).toBe(403)
  })
})
