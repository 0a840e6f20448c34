// The floor for `npm run bench`: the product's SQL for the four measured routes behind a bare node:http
// handler and a pg Pool of the same size (10), with no framework, session, guard or validation.
// `DATABASE_URL=… FLOOR_PORT=… WORKSHOP_ID=… tsx scripts/bench-floor.ts`
import { createServer, type IncomingMessage } from 'node:http'
import pg from 'pg'
import { evaluate, workshopSettingsSchema, defaultSettings } from '../shared/compute'
import type { PlatformLike, WorkshopSettings } from '../shared/compute/types'
import { jsonPatch } from '../shared/utils/json-patch'

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 10 })
const port = Number(process.env.FLOOR_PORT)
const q = async <T = Record<string, unknown>>(sql: string, params: unknown[]) => (await pool.query(sql, params)).rows as T[]
const settingsOf = (s: unknown): WorkshopSettings => { const p = workshopSettingsSchema.safeParse(s ?? {}); return p.success ? p.data : defaultSettings }

// GET /api/vehicles: the page with its count, the drive unit's key and name and the owner joined, in one query.
async function vehicles(workshopId: number) {
  const rows = await q<{ total: string }>(`SELECT v.*, pl.key AS "platformKey", pl.name AS "platformName", o.name AS "ownerName", count(*) OVER () AS total
    FROM vehicles v LEFT JOIN platforms pl ON pl.id = v."platformId" LEFT JOIN users o ON o.id = v."ownerUserId"
    WHERE v."workshopId" = $1 ORDER BY v."stockRef" ASC, v.id ASC LIMIT 20 OFFSET 0`, [workshopId])
  return { items: rows, total: Number(rows[0]?.total ?? 0) }
}

// GET /api/vehicles/:id/history?limit=50: the car, then the keyset page of events with actor and car joined.
async function history(workshopId: number, vehicleId: number) {
  await q('SELECT id FROM vehicles WHERE id = $1 AND "workshopId" = $2', [vehicleId, workshopId])
  const rows = await q(`SELECT e.id, e."vehicleId", e."actorId", e.action, e."entityType", e."entityId", e.data, e."createdAt", e."prevHash", e.hash,
      u.name AS "actorName", v."stockRef"
    FROM audit_events e LEFT JOIN users u ON u.id = e."actorId" LEFT JOIN vehicles v ON v.id = e."vehicleId"
    WHERE e."workshopId" = $1 AND e."vehicleId" = $2 ORDER BY e.id DESC LIMIT 51`, [workshopId, vehicleId])
  const page = rows.slice(0, 50) as { id: string, entityType: string, entityId: string, data: { patch?: { op: string }[], before?: unknown } }[]
  // The before-values of patches that carry none: each such entity's earlier events, as server/utils/history/read.ts reads them.
  const oldest = new Map<string, { et: string, ei: string, id: string }>()
  for (const r of page) {
    if (Array.isArray(r.data.patch) && r.data.patch.some(o => o.op !== 'test') && r.data.before === undefined) oldest.set(`${r.entityType}\u0000${r.entityId}`, { et: r.entityType, ei: r.entityId, id: r.id })
  }
  for (const r of page) { const k = `${r.entityType}\u0000${r.entityId}`; if (oldest.has(k)) oldest.get(k)!.id = r.id }
  const tuples = [...oldest.values()]
  const earlier = tuples.length
    ? await q(`SELECT x.id, x.action, x."entityType", x."entityId", x.data FROM (VALUES ${tuples.map((_, i) => `($${3 * i + 2}, $${3 * i + 3}, $${3 * i + 4})`).join(', ')}) AS q(et, ei, bound) CROSS JOIN LATERAL (
        SELECT id, action, "entityType", "entityId", CASE WHEN action = 'version.created' THEN data ELSE jsonb_build_object('patch', data->'patch', 'after', data->'after') END AS data FROM audit_events
        WHERE "workshopId" = $1 AND "entityType" = q.et AND "entityId" = q.ei AND id < q.bound::bigint ORDER BY id DESC LIMIT 100) x ORDER BY x.id`, [workshopId, ...tuples.flatMap(t => [t.et, t.ei, t.id])])
    : []
  return { items: page, earlier: earlier.length, nextCursor: rows.length > 50 ? page[49]!.id : null }
}

interface PairRow { id: number, parameters: Record<string, number>, spec: never, platformKey: string, platformName: string, motorMaxRpm: number, schema: unknown, settings: unknown }
const platformOf = (r: PairRow): PlatformLike => ({ key: r.platformKey, name: r.platformName, motorMaxRpm: r.motorMaxRpm, schema: r.schema })

// GET /api/versions/:a/diff/:b: both versions in one query, both evaluated, the settings' patch.
async function diff(workshopId: number, a: number, b: number) {
  const rows = await q<PairRow>(`SELECT pv.id, pv."versionNo", pv.state, pv.parameters, p.name AS "profileName", v.id AS "vehicleId", v.spec,
      pl.key AS "platformKey", pl.name AS "platformName", pl."motorMaxRpm", pl.schema, w.settings
    FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId" JOIN vehicles v ON v.id = p."vehicleId"
    JOIN platforms pl ON pl.id = v."platformId" JOIN workshops w ON w.id = pv."workshopId"
    WHERE pv.id = ANY($1) AND pv."workshopId" = $2`, [[a, b], workshopId])
  const ra = rows.find(r => r.id === a)!
  const rb = rows.find(r => r.id === b)!
  const settings = settingsOf(ra.settings)
  return { a: evaluate(ra.spec, platformOf(ra), ra.parameters, settings), b: evaluate(rb.spec, platformOf(rb), rb.parameters, settings), patch: jsonPatch(ra.parameters, rb.parameters) }
}

// POST /api/evaluate {vehicleId, platformKey, parameters}: the workshop's settings, the car and its drive unit in one query.
async function evaluateCar(workshopId: number, body: { vehicleId: number, platformKey: string, parameters: Record<string, unknown> }) {
  const [row] = await q<{ spec: never, key: string, name: string, motorMaxRpm: number, schema: unknown, settings: unknown }>(`SELECT w.settings, v.spec, pl.key, pl.name, pl."motorMaxRpm", pl.schema
    FROM workshops w LEFT JOIN vehicles v ON v.id = $2 AND v."workshopId" = w.id LEFT JOIN platforms pl ON pl.id = v."platformId" WHERE w.id = $1`, [workshopId, body.vehicleId])
  return evaluate(row!.spec, row!, body.parameters, settingsOf(row!.settings))
}

const readBody = async (req: IncomingMessage) => { const chunks: Buffer[] = []; for await (const c of req) chunks.push(c as Buffer); return JSON.parse(Buffer.concat(chunks).toString('utf8')) }

createServer(async (req, res) => {
  try {
    const url = new URL(req.url ?? '/', 'http://floor')
    const workshopId = Number(url.searchParams.get('w'))
    let m: RegExpMatchArray | null
    let out: unknown
    if (url.pathname === '/health') out = { ok: true }
    else if (url.pathname === '/cpu') { const c = process.cpuUsage(); out = { micros: c.user + c.system } } // for the bench's CPU per answer
    else if (url.pathname === '/vehicles') out = await vehicles(workshopId)
    else if ((m = url.pathname.match(/^\/vehicles\/(\d+)\/history$/))) out = await history(workshopId, Number(m[1]))
    else if ((m = url.pathname.match(/^\/versions\/(\d+)\/diff\/(\d+)$/))) out = await diff(workshopId, Number(m[1]), Number(m[2]))
    else if (url.pathname === '/evaluate' && req.method === 'POST') out = await evaluateCar(workshopId, await readBody(req))
    else { res.writeHead(404).end(); return }
    res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(out))
  } catch (e) {
    res.writeHead(500).end(String((e as Error).message))
  }
}).listen(port, '127.0.0.1', () => console.log(`[bench floor] listening on ${port}`))
