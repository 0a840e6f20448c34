import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import fc from 'fast-check'
import { describe, it, expect } from 'vitest'
import sharp from 'sharp'
import { useRunningServer, signIn, anonymous, withDatabase, baseUrl, type Caller, type Answer } from './helpers'
import { approvedVersion, multipart, newCar, newProfile, recordRoadTest, upload } from './road-test-fixtures'
import { addSnag } from './fixtures'
import { testSpec } from './version-fixtures'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'
import { apiDir, routeFiles, routeUrl, type Route } from './routes'
import { demoFixtures, routeAccess } from './route-access'
import type { Role } from '../../shared/schemas/roles'

// One field of each body the route validates, with the type its schema wants (shared/schemas/*): the generated
// bodies always put a wrong value there, so none can be accepted and change the demo workshop.
type Kind = 'string' | 'number' | 'boolean' | 'array' | 'object'
const bodyField: Record<string, [string, Kind]> = {
  'audit/head-mail.post.ts': ['to', 'string'],
  'auth/login.post.ts': ['email', 'string'],
  'evaluate.post.ts': ['platformKey', 'string'],
  'fleet/recheck.post.ts': ['note', 'string'],
  'fleet/search.csv.post.ts': ['conditions', 'array'],
  'fleet/search.post.ts': ['conditions', 'array'],
  'kits/[id].patch.ts': ['fits', 'array'],
  'kits/index.post.ts': ['name', 'string'],
  'profiles/[id]/rebase.post.ts': ['choices', 'object'],
  'platforms/index.post.ts': ['motorMaxRpm', 'number'],
  'profiles/[id]/versions.post.ts': ['fromVersionId', 'number'],
  'road-tests/[id]/roadside-version.post.ts': ['rationale', 'string'],
  'snags/[id].patch.ts': ['blocking', 'boolean'],
  'users/[id].patch.ts': ['active', 'boolean'],
  'users/index.post.ts': ['roles', 'array'],
  'vehicles/[id].patch.ts': ['year', 'number'],
  'vehicles/[id]/profiles.post.ts': ['name', 'string'],
  'vehicles/[id]/readback.post.ts': ['source', 'string'],
  'vehicles/[id]/snags.post.ts': ['title', 'string'],
  'vehicles/index.post.ts': ['year', 'number'],
  'versions/[id].patch.ts': ['lockVersion', 'number'],
  'versions/[id]/approve.post.ts': ['comment', 'string'],
  'versions/[id]/reject.post.ts': ['comment', 'string'],
  'versions/[id]/road-tests.post.ts': ['verdict', 'string'],
  'versions/[id]/submit.post.ts': ['justifications', 'object'],
  'workshop/settings.patch.ts': ['minStartGradePct', 'number'],
  'workshop/checks/index.post.ts': ['label', 'string'],
  'workshop/checks/[key].patch.ts': ['required', 'boolean']
}
// The query keys each listing or upload reads (shared/schemas/history.ts, vehicle.ts, snag.ts; the routes' own).
const queryKeys: Record<string, string[]> = {
  'attachments/[id].get.ts': ['size'],
  'audit/events.csv.get.ts': ['cursor', 'limit', 'action', 'actorId', 'from', 'to', 'vehicleId'],
  'audit/events.get.ts': ['cursor', 'limit', 'action', 'actorId', 'from', 'to', 'vehicleId', 'include'],
  'audit/facets.get.ts': ['vehicleId'],
  'audit/verify.get.ts': ['head'],
  'road-tests/[id]/photos.post.ts': ['caption'],
  'snags/[id]/photos.post.ts': ['caption'],
  'snags/index.get.ts': ['kind', 'status', 'priority', 'blocking', 'assigneeId'],
  'vehicles/[id]/history.csv.get.ts': ['cursor', 'limit', 'action', 'actorId', 'from', 'to'],
  'vehicles/[id]/history.get.ts': ['cursor', 'limit', 'action', 'actorId', 'from', 'to', 'include'],
  'vehicles/[id]/snags.get.ts': ['kind', 'status', 'priority', 'blocking', 'assigneeId'],
  'vehicles/index.get.ts': ['q', 'status', 'sort', 'dir', 'page', 'pageSize']
}

const source = (r: Route) => readFileSync(join(apiDir, r.file), 'utf8')
const RUNS = 12

const huge = 'x'.repeat(100 * 1024)
const deep = (levels: number, leaf: unknown = 1): unknown => { let v = leaf; for (let i = 0; i < levels; i++) v = i % 2 ? [v] : { a: v }; return v }
const oddities = fc.constantFrom<unknown>(huge, 1e308, -1e308, 'NaN', 'Infinity', '-Infinity', null, deep(1000), [], {}, true, 0, -1, 2147483648, 1.5, '', ' ', '\u0000')
const anyValue = fc.oneof(oddities, fc.jsonValue({ maxDepth: 3 }), fc.string({ maxLength: 40 }), fc.double())
const kindOf = (v: unknown): Kind | 'null' => v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v as Kind
// Wrong for the field: another JSON type (NaN and Infinity travel as null in JSON), or a number far out of range.
const wrongFor = (kind: Kind) => anyValue.filter(v => kind === 'number' ? kindOf(v) !== 'number' || Math.abs(v as number) > 1e300 : kindOf(v) !== kind)
const extras = fc.dictionary(fc.string({ minLength: 1, maxLength: 12 }).filter(k => !['__proto__', 'constructor', 'prototype'].includes(k)), anyValue, { maxKeys: 4 })

// A 400 names what was wrong: the field in data.fields[].path, or in the message.
function namesField(res: Answer, field: string) {
  const paths: string[] = (res.body?.data?.fields ?? []).map((f: { path: string }) => f.path)
  return paths.some(p => p === field || p.startsWith(`${field}.`)) || String(res.body?.message ?? '').includes(field)
}
// evaluate reads a small, shallow body (server/utils/guards/small-body.ts): past its limits it answers 413, or
// 400 about the body's depth, before any field is looked at.
const SMALL_BODY_ROUTES = new Set(['evaluate.post.ts'])
const bodyLimitHit = (r: Route, res: Answer) => SMALL_BODY_ROUTES.has(r.file) && (res.status === 413 || /request body nests deeper|more than \d+ values/.test(String(res.body?.message ?? '')))
const namesBody = (res: Answer) => (res.body?.data?.fields ?? []).length > 0 || /body|JSON|object/i.test(String(res.body?.message ?? ''))

describe('malformed input never breaks a route, and a refusal names the field', async () => {
  await useRunningServer()
  const fixtures = await demoFixtures()
  const callers = new Map<Role, Caller>()
  const as = async (r: Route) => {
    if (r.file === 'auth/login.post.ts') return anonymous
    const role = routeAccess[r.file]!.roles[0]!
    if (!callers.has(role)) callers.set(role, await signIn(`${role}@voltwright.test`))
    return callers.get(role)!
  }
  const urlFor = (r: Route) => routeUrl(r, p => fixtures[routeAccess[r.file]!.params![p]!])
  const routes = routeFiles()
  const withBody = routes.filter(r => source(r).includes('readValidatedBody') || source(r).includes('readSmallJsonBody'))
  const withQuery = routes.filter(r => source(r).includes('getValidatedQuery'))

  it('knows a field of every body and the keys of every query a route reads', () => {
    expect(withBody.map(r => r.file).sort()).toEqual(Object.keys(bodyField).sort())
    expect(withQuery.map(r => r.file).sort()).toEqual(Object.keys(queryKeys).sort())
  })

  it('refuses a wrong value in a field, with or without extra fields, with a 400 naming it', async () => {
    for (const r of withBody) {
      const caller = await as(r)
      const [field, kind] = bodyField[r.file]!
      await fc.assert(fc.asyncProperty(wrongFor(kind), extras, async (value, extra) => {
        const body = { ...extra, [field]: value }
        const res = await caller.call(r.method, urlFor(r), body)
        if (bodyLimitHit(r, res)) return
        expect(res.status, `${r.file} ${JSON.stringify(res.body).slice(0, 200)}`).toBe(400)
        // A "__proto__" key anywhere makes the JSON reader refuse the whole body (prototype pollution), before any field is looked at.
        const named = JSON.stringify(body).includes('"__proto__"') ? namesBody(res) : namesField(res, field)
        expect(named, `${r.file}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(true)
      }), { numRuns: RUNS })
    }
  })

  it('refuses a body that is not an object, deeply nested or broken JSON with a 400 about the body', async () => {
    const notObject = fc.oneof(fc.constantFrom<unknown>(deep(1000), [deep(999)], 1e308, 'NaN', huge, [], null), fc.array(anyValue, { maxLength: 3 }), fc.string({ maxLength: 20 }), fc.double())
    const whole = JSON.stringify({ name: 'Road', nested: { list: [1, 2, 3], text: 'café' } })
    const truncated = fc.integer({ min: 1, max: whole.length - 1 }).map(n => whole.slice(0, n))
    for (const r of withBody) {
      const caller = await as(r)
      await fc.assert(fc.asyncProperty(fc.oneof(notObject.map(v => JSON.stringify(v) ?? 'null'), truncated), async (text) => {
        const res = await caller.call(r.method, urlFor(r), text)
        if (bodyLimitHit(r, res)) return
        expect(res.status, `${r.file} ${text.slice(0, 60)} → ${JSON.stringify(res.body).slice(0, 200)}`).toBe(400)
        expect(namesBody(res), `${r.file}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(true)
      }), { numRuns: RUNS })
    }
  })

  it('refuses the wrong content type without a server error', async () => {
    const bodies: [string, string][] = [['text/plain', 'not json at all'], ['application/x-www-form-urlencoded', 'a=1&b=2'], ['application/xml', '<a/>'], ['multipart/form-data; boundary=x', '--x\r\nbroken']]
    const wrong: string[] = []
    for (const r of withBody) {
      const caller = await as(r)
      for (const [type, text] of bodies) {
        const res = await caller.call(r.method, urlFor(r), text, { 'content-type': type })
        if (res.status < 400 || res.status >= 500 || !res.body?.message) wrong.push(`${r.file} as ${type} → ${res.status} ${JSON.stringify(res.body).slice(0, 120)}`)
      }
    }
    expect(wrong).toEqual([])
  })

  it('refuses text holding U+0000, which PostgreSQL cannot store, with a 400 naming where it is', async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const list = await tuner.call('GET', '/api/vehicles?q=%00')
    expect(list.status).toBe(400)
    expect(list.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['q'])
    const body = await tuner.call('POST', '/api/vehicles', { stockRef: 'NUL\u0000', make: 'Testwick', model: 'Saloon', year: 1964, platformKey: 'fenlow-45', spec: testSpec })
    expect(body.status).toBe(400)
    expect(body.body.data.fields).toEqual([{ path: 'stockRef', message: expect.stringMatching(/U\+0000/) }])
  })

  it('answers odd queries without a server error, and a 400 names the key', async () => {
    const value = fc.oneof(fc.constantFrom(huge, '1e308', '-1e308', 'NaN', 'Infinity', '-Infinity', '', '-1', '0', '2147483648', '1.5', '../../etc', '%00', '\u0000', 'true'), fc.string({ maxLength: 30 }))
    for (const r of withQuery) {
      const caller = await as(r)
      const keys = queryKeys[r.file]!
      await fc.assert(fc.asyncProperty(fc.constantFrom(...keys), fc.array(value, { minLength: 1, maxLength: 2 }), async (key, values) => {
        const query = values.map(v => `${encodeURIComponent(key)}=${encodeURIComponent(v)}`).join('&')
        const res = await caller.call(r.method, `${urlFor(r)}?${query}`, r.method === 'GET' ? undefined : [])
        expect(res.status, `${r.file}?${query.slice(0, 80)} → ${JSON.stringify(res.body).slice(0, 200)}`).toBeLessThan(500)
        if (res.status === 400) expect(namesField(res, key), `${r.file}?${query.slice(0, 80)}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(true)
      }), { numRuns: RUNS })
    }
  })

  uploads()
})

// A multipart body of one file, produced chunk by chunk, so a file of any size is sent without holding it in memory.
function streamedUpload(filename: string, type: string, bytes: number, chunk: (n: number) => Buffer, head = '') {
  const boundary = `----voltwright${Date.now()}`
  async function* parts() {
    yield Buffer.from(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="${filename}"\r\ncontent-type: ${type}\r\n\r\n${head}`)
    for (let sent = 0, n = 0; sent < bytes; n++) {
      const next = chunk(n)
      sent += next.length
      yield next
    }
    yield Buffer.from(`\r\n--${boundary}--\r\n`)
  }
  const it = parts()
  const body = new ReadableStream({ async pull(c) { const n = await it.next(); if (n.done) c.close(); else c.enqueue(n.value) } })
  return { body, contentType: `multipart/form-data; boundary=${boundary}` }
}

// A multipart body cut off before its closing boundary.
function truncatedUpload(filename: string, type: string, text: string) {
  const boundary = '----voltwrightcut'
  return { body: `--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="${filename}"\r\ncontent-type: ${type}\r\n\r\n${text}`, contentType: `multipart/form-data; boundary=${boundary}` }
}

async function send(caller: Caller, path: string, b: { body: BodyInit, contentType: string }) {
  const res = await fetch(`${baseUrl}${path}`, { method: 'POST', headers: { 'cookie': caller.cookie, 'origin': baseUrl, 'content-type': b.contentType }, body: b.body, duplex: 'half' } as RequestInit)
  const text = await res.text()
  let body: any = text
  try { body = JSON.parse(text) } catch { /* not JSON */ }
  return { status: res.status, body }
}

const storedName = (id: number) => withDatabase(async c => (await c.query('SELECT filename FROM attachments WHERE id = $1', [id])).rows[0].filename as string)
const car0 = { massKg: 1200, rollingRadiusM: 0.296, finalDriveRatio: 7.5, powerCapKw: 80, torqueCapNm: 260, liftOffDecelMs2: 1.2, brakeRegenDecelMs2: 2, packVoltageV: 350, creepSpeedKph: 5 }
const telemetryHeader = 'time_s,speed_kph,motor_torque_nm,motor_rpm,pedal_pct,brake,motor_c,inverter_c,battery_c,battery_v,battery_a'
// 16 384 good rows a chunk, the clock running on at 100 Hz, so the log is refused for its size alone.
const csvRows = (n: number) => Buffer.from(Array.from({ length: 16384 }, (_, k) => `${((n * 16384 + k) / 100).toFixed(2)},12,30,900,20,0,40,35,25,350,20\n`).join(''))

// Called inside the suite above, which has the running server set up.
function uploads() {
  describe('uploads: empty, truncated, oversized, mistyped and with path parts in the name', async () => {
  const tuner = await signIn('tuner@voltwright.test')
  const tester = await signIn('tester@voltwright.test')
  const car = await newCar(tuner)
  const roadTestId = await recordRoadTest(tester, await approvedVersion(await newProfile(car.id)))
  const snagId = await addSnag(car.id, 'remedial', 'Sill seam lifting')
  const telemetry = `/api/road-tests/${roadTestId}/telemetry`
  const photos = `/api/snags/${snagId}/photos`
  const png = await sharp({ create: { width: 12, height: 8, channels: 3, background: 'white' } }).png().toBuffer()
  const csv = telemetryCsv(syntheticDrive(car0))

  it('refuses an empty file and a body with no file, naming the field', async () => {
    for (const path of [telemetry, photos]) {
      const empty = await upload(tester, path, multipart('', path === telemetry ? 'log.csv' : 'sill.png', path === telemetry ? 'text/csv' : 'image/png'))
      expect([400, 415, 422], `${path} ${JSON.stringify(empty.body)}`).toContain(empty.status)
      expect(empty.body.message).toBeTruthy()
      const none = await upload(tester, path, new FormData())
      expect(none.status, path).toBe(400)
      expect(none.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['file'])
    }
  })

  it('refuses a multipart body cut off in the middle with a 400', async () => {
    expect((await send(tester, telemetry, truncatedUpload('log.csv', 'text/csv', csv.slice(0, 5000)))).status).toBe(400)
    expect((await send(tester, photos, truncatedUpload('sill.png', 'image/png', png.subarray(0, 40).toString('latin1')))).status).toBe(400)
  })

  it('refuses a streamed file over the limit with 413 (telemetry over 50 MB, a photo over 15 MB)', async () => {
    const log = await send(tester, telemetry, streamedUpload('big.csv', 'text/csv', 51 * 1024 * 1024, csvRows, `${telemetryHeader}\n`))
    expect(log.status).toBe(413)
    expect(log.body.message).toContain('50 MB')
    const photo = await send(tester, photos, streamedUpload('big.png', 'image/png', 16 * 1024 * 1024, () => Buffer.alloc(1024 * 1024, 7)))
    expect(photo.status).toBe(413)
    expect(await withDatabase(async c => Number((await c.query('SELECT count(*) AS n FROM attachments WHERE filename IN (\'big.csv\', \'big.png\')')).rows[0].n))).toBe(0)
  }, 90_000)

  it('refuses the wrong type of file with 415', async () => {
    expect((await upload(tester, telemetry, multipart(png, 'trace.png', 'image/png'))).status).toBe(415)
    expect((await upload(tester, photos, multipart(csv, 'sill.csv', 'text/csv'))).status).toBe(415)
    expect((await upload(tester, photos, multipart('GIF89a not really', 'sill.gif', 'image/gif'))).status).toBe(415)
  })

  it('keeps only the last part of a file name that has path parts', async () => {
    for (const [path, name, bytes, type, expected] of [
      [telemetry, '../../etc/passwd.csv', csv, 'text/csv', 'passwd.csv'],
      [photos, '..\\..\\windows\\sill.png', png, 'image/png', 'sill.png'],
      [photos, '/var/lib/../../sill-2.png', png, 'image/png', 'sill-2.png']
    ] as const) {
      const res = await upload(tester, path, multipart(bytes, name, type))
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      const id = res.body.attachment?.id ?? res.body.attachmentId ?? res.body.id
      const stored = await storedName(id)
      expect(stored).toBe(expected)
      expect(stored).not.toMatch(/[\\/]|\.\./)
    }
  })

  it('drops control characters from a file name sent encoded (RFC 8187), so U+0000 never reaches the database', async () => {
    // A raw control character in a part header is refused by the multipart reader itself; encoded, it is decoded.
    const boundary = '----voltwright-encoded-name'
    const head = `--${boundary}\r\ncontent-disposition: form-data; name="file"; filename*=UTF-8''sill%00-3%07.png\r\ncontent-type: image/png\r\n\r\n`
    const body = Buffer.concat([Buffer.from(head), png, Buffer.from(`\r\n--${boundary}--\r\n`)])
    const res = await send(tester, photos, { body, contentType: `multipart/form-data; boundary=${boundary}` })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(await storedName(res.body.attachment?.id ?? res.body.attachmentId ?? res.body.id)).toBe('sill-3.png')
  })
  })
}
