import { describe, it, expect, afterAll } from 'vitest'
import { S3Client, ListObjectsV2Command } from '@aws-sdk/client-s3'
import { useRunningServer, signIn, withDatabase, baseUrl } from './helpers'
import { service } from './services'
import { newCar as newReviewCar, newProfile as newDraft } from './version-fixtures'
import { approvedVersion, multipart, newCar, newProfile, recordRoadTest, sha256, upload } from './road-test-fixtures'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'

// maildev's REST API: GET /api/email lists what the SMTP sink received.
const mailApi = process.env.VOLTWRIGHT_MAIL_API ?? 'http://127.0.0.1:1090'
const s3Endpoint = process.env.NUXT_S3_ENDPOINT ?? 'http://127.0.0.1:4579'
const mailSink = service('mail-sink', 'VOLTWRIGHT_MAIL_SINK', `${mailApi}/api/email`)
const objectStore = service('object-store', 'VOLTWRIGHT_OBJECT_STORE', `${s3Endpoint}/`)

const s3 = new S3Client({ endpoint: s3Endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }, requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED' })
async function storedKeys(): Promise<string[]> {
  const keys: string[] = []
  let token: string | undefined
  do {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: 'voltwright', ContinuationToken: token }))
    keys.push(...(page.Contents ?? []).map(o => o.Key!))
    token = page.NextContinuationToken
  } while (token)
  return keys.sort()
}

interface OutboxRow { to: string, state: string, attempts: number, lastError: string | null }
const outboxFor = (link: string) => withDatabase(async c => (await c.query(
  `SELECT "to", state, attempts, "lastError" FROM mail_outbox WHERE subject LIKE 'Review wanted:%' AND text LIKE $1 ORDER BY "to"`, [`%${link}\n%`])).rows as OutboxRow[])

const car0 = { massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 1.2, brakeRegenDecelMs2: 2, packVoltageV: 350, creepSpeedKph: 5 }

describe('the SMTP sink and the object store down', async () => {
  await useRunningServer()
  const lead = await signIn('lead@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  let mailDown = false
  let storeDown = false
  afterAll(async () => {
    if (mailDown) await mailSink.start()
    if (storeDown) await objectStore.start()
  })

  it('commits the change while the SMTP sink is down, keeps the mail in the outbox and sends it when the sink is back', async () => {
    const car = await newReviewCar(lead)
    const draft = await newDraft(lead, car.id)
    const link = `${baseUrl}/versions/${draft.id}`
    await mailSink.stop()
    mailDown = true

    const submitted = await lead.call('POST', `/api/versions/${draft.id}/submit`, {})
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200)
    // The change is committed with its audit event, whatever the mail does.
    const committed = await withDatabase(async c => (await c.query(
      `SELECT pv.state, (SELECT count(*)::int FROM audit_events a WHERE a."entityType" = 'version' AND a."entityId" = pv.id::text AND a.action = 'version.submitted') AS events
         FROM profile_versions pv WHERE pv.id = $1`, [draft.id])).rows[0])
    expect(committed).toEqual({ state: 'in-review', events: 1 })
    expect((await lead.call('GET', `/api/versions/${draft.id}`)).body.state).toBe('in-review')

    // The sender keeps trying (2 s, then 4 s later …): the mail waits, pending, with its attempts and the error.
    await expect.poll(async () => Math.min(...(await outboxFor(link)).map(r => r.attempts)), { timeout: 30000, interval: 500 }).toBeGreaterThanOrEqual(2)
    const waiting = await outboxFor(link)
    expect(waiting.length).toBeGreaterThan(0)
    expect(waiting.every(r => r.state === 'pending' && r.lastError !== null)).toBe(true)
    expect(waiting.map(r => r.to)).not.toContain('lead@voltwright.test')

    await mailSink.start()
    mailDown = false
    await expect.poll(async () => (await outboxFor(link)).every(r => r.state === 'sent'), { timeout: 40000, interval: 500 }).toBe(true)
    const sunk = await (await fetch(`${mailApi}/api/email`)).json() as { subject: string, text: string, to: { address: string }[] }[]
    const received = sunk.filter(m => m.subject.startsWith('Review wanted') && m.text.includes(`${link}\n`)).map(m => m.to[0]!.address).sort()
    expect(received).toEqual(waiting.map(r => r.to))
  }, 90000)

  it('refuses an upload cleanly while the object store is down, stores nothing, and recovers when it is back', async () => {
    const car = await newCar(tuner)
    const profileId = await newProfile(car.id)
    const roadTest = async () => recordRoadTest(tester, await approvedVersion(profileId))
    const [before, during, after] = [await roadTest(), await roadTest(), await roadTest()]
    const csv = telemetryCsv(syntheticDrive(car0))
    const send = (roadTestId: number) => upload(tester, `/api/road-tests/${roadTestId}/telemetry`, multipart(csv, 'forge-loop.csv', 'text/csv'))
    const stored = await send(before)
    expect(stored.status, JSON.stringify(stored.body)).toBe(201)
    const rows = () => withDatabase(async c => (await c.query(
      `SELECT (SELECT count(*)::int FROM attachments) AS attachments, (SELECT count(*)::int FROM telemetry_logs) AS logs,
              (SELECT count(*)::int FROM audit_events WHERE action = 'road-test.telemetry-uploaded') AS events`)).rows[0])
    const keysBefore = await storedKeys()
    const rowsBefore = await rows()

    await objectStore.stop()
    storeDown = true
    const refused = await send(during)
    expect(refused.status).toBe(503)
    expect(refused.body.message).toMatch(/file store cannot be reached/)
    expect(JSON.stringify(refused.body)).not.toMatch(/ECONNREFUSED|S3|s3rver|stack|at .*\.js/i)
    expect(refused.headers.get('retry-after')).toBe('5')
    // Reading a stored file while the store is down is a 503 too, not a 500.
    const download = await fetch(`${baseUrl}/api/attachments/${stored.body.attachment.id}`, { headers: { cookie: tester.cookie } })
    expect(download.status).toBe(503)
    // No attachment, telemetry row or audit event was left behind.
    expect(await rows()).toEqual(rowsBefore)

    await objectStore.start()
    storeDown = false
    // Nothing half-stored: the store holds exactly what it held before the refused upload.
    expect(await storedKeys()).toEqual(keysBefore)
    const back = await send(after)
    expect(back.status, JSON.stringify(back.body)).toBe(201)
    expect(back.body.attachment.sha256).toBe(sha256(csv))
    const again = await fetch(`${baseUrl}/api/attachments/${stored.body.attachment.id}`, { headers: { cookie: tester.cookie } })
    expect(again.status).toBe(200)
    expect(sha256(Buffer.from(await again.arrayBuffer()))).toBe(sha256(csv))
    // The refused road test takes its log once the store is back.
    expect((await send(during)).status).toBe(201)
  }, 90000)
})
