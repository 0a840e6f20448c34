// A big history for the benchmarks: `DATABASE_URL=… npm run seed:big -- [--events 200000] [--cars 200]`.
// Writes into a workshop of its own ("Ledger Hall Conversions", people @ledger.voltwright.test, demo password),
// appending to its chain if it exists. Events go in batches of 5,000 under the chain's advisory lock, each
// hashed exactly as appendAuditEvent does, so the verifier checks them like any other.
import pg from 'pg'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { CURRENT_FORM, eventHash, type RecordedActor } from '../server/utils/history/audit'
import { defaultParameters, findPlatform } from '../shared/platforms'
import { exampleSpec } from '../shared/compute/example'

const arg = (name: string, fallback: number) => { const i = process.argv.indexOf(`--${name}`); return i > 0 ? Number(process.argv[i + 1]) : fallback }
const EVENTS = arg('events', 200_000)
const CARS = arg('cars', 200)
const BATCH = 5000
const WORKSHOP = 'Ledger Hall Conversions'
const PEOPLE = ['admin', 'auditor', 'tuner', 'engineer', 'tester']

const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')
const db = new pg.Client({ connectionString: url })
await db.connect()
const q = async <T = Record<string, unknown>>(sql: string, params: unknown[] = []) => (await db.query(sql, params)).rows as T[]

async function workshop(): Promise<{ id: number, people: number[], names: Map<number, RecordedActor>, cars: number[] }> {
  let [w] = await q<{ id: number }>('SELECT id FROM workshops WHERE name = $1', [WORKSHOP])
  if (!w) [w] = await q<{ id: number }>(`INSERT INTO workshops (name, settings) VALUES ($1, '{}') RETURNING id`, [WORKSHOP])
  const hash = await new Hash(new Scrypt({})).make('voltwright-demo')
  for (const role of PEOPLE) {
    await q(`INSERT INTO users ("workshopId", email, name, "passwordHash", roles) VALUES ($1, $2, $3, $4, $5) ON CONFLICT (email) DO NOTHING`,
      [w!.id, `${role}@ledger.voltwright.test`, `Ledger ${role}`, hash, [role]])
  }
  const rows = await q<{ id: number, name: string, email: string }>('SELECT id, name, email FROM users WHERE "workshopId" = $1 ORDER BY id', [w!.id])
  const people = rows.map(p => p.id)
  const names = new Map(rows.map(p => [p.id, { name: p.name, email: p.email }]))
  const [platform] = await q<{ id: number }>('SELECT id FROM platforms WHERE key = $1', ['fenlow-45'])
  if (!platform) throw new Error('No drive units in this database yet: run `npm start` (or the demo seed) once first.')
  const have = (await q<{ n: string }>('SELECT count(*) AS n FROM vehicles WHERE "workshopId" = $1', [w!.id]))[0]!.n
  for (let i = Number(have); i < CARS; i++) {
    await q(`INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, spec, "platformId", status) VALUES ($1, $2, 'Ledgerby', 'Benchmark Saloon', 1968, $3, $4, 'converting')`,
      [w!.id, `LH-${String(i + 1).padStart(4, '0')}`, JSON.stringify(exampleSpec), platform.id])
  }
  const cars = (await q<{ id: number }>('SELECT id FROM vehicles WHERE "workshopId" = $1 ORDER BY id', [w!.id])).map(c => c.id)
  return { id: w!.id, people, names, cars }
}

const pick = <T>(xs: T[], i: number) => xs[i % xs.length]!
// mulberry32: a small seeded generator, so every run writes the same mix.
function random(seed: number) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
const draw = random(7301)
const parameters = defaultParameters(findPlatform('fenlow-45')!)

// A plausible mix: facts edited, versions drafted and reviewed, snags raised, read-backs recorded.
const versionOf = new Map<number, string>()
function eventFor(n: number, cars: number[], people: number[]) {
  const vehicleId = pick(cars, Math.floor(draw() * cars.length))
  const actorId = pick(people, Math.floor(draw() * people.length))
  const kind = Math.floor(draw() * 10)
  if (kind < 3) return { vehicleId, actorId, action: 'vehicle.updated', entityType: 'vehicle', entityId: String(vehicleId), data: { patch: [{ op: 'replace', path: '/registration', value: `LH ${n}` }] } }
  if (kind < 5 || !versionOf.has(vehicleId)) {
    versionOf.set(vehicleId, `${vehicleId}-${n}`)
    return { vehicleId, actorId, action: 'version.created', entityType: 'version', entityId: `${vehicleId}-${n}`, data: { after: { versionNo: 1 + (n % 40), state: 'draft', parameters: { ...parameters, powerCapKw: 20 + (n % 25) } } } }
  }
  if (kind < 7) return { vehicleId, actorId, action: 'version.updated', entityType: 'version', entityId: versionOf.get(vehicleId)!, data: { patch: [{ op: 'replace', path: '/parameters/powerCapKw', value: 20 + (n % 25) }] } }
  if (kind < 9) return { vehicleId, actorId, action: 'snag.created', entityType: 'snag', entityId: `${vehicleId}-${n}`, data: { after: { kind: 'remedial', title: `Bench snag ${n}`, priority: 'normal' } } }
  return { vehicleId, actorId, action: 'readback.matched', entityType: 'readback', entityId: `${vehicleId}-${n}`, data: { matches: true, differences: [], source: 'file', patch: [], before: { driftedAt: null } } }
}

const w = await workshop()
const started = performance.now()
// Spread up to now (one a second on a fresh chain), after whatever the chain already holds.
const [last] = await q<{ createdAt: Date }>('SELECT "createdAt" FROM audit_events WHERE "workshopId" = $1 ORDER BY id DESC LIMIT 1', [w.id])
const epoch = last ? last.createdAt.getTime() + 1 : Date.now() - EVENTS * 1000
const step = Math.max(1, Math.floor((Date.now() - epoch) / EVENTS))
let written = 0
while (written < EVENTS) {
  const size = Math.min(BATCH, EVENTS - written)
  await q('BEGIN')
  await q('SELECT pg_advisory_xact_lock(7301, $1)', [w.id])
  const [head] = await q<{ hash: string }>('SELECT hash FROM audit_events WHERE "workshopId" = $1 ORDER BY id DESC LIMIT 1', [w.id])
  const cols: unknown[][] = Array.from({ length: 12 }, () => [])
  let prevHash: string | null = head?.hash ?? null
  for (let i = 0; i < size; i++) {
    const n = written + i
    const e = eventFor(n, w.cars, w.people)
    const createdAt = new Date(epoch + n * step)
    const actor = e.actorId === null ? null : w.names.get(e.actorId)!
    const row = { form: CURRENT_FORM, workshopId: w.id, ...e, actor, createdAt, prevHash }
    const hash = eventHash(row)
    ;[w.id, e.vehicleId, e.actorId, e.action, e.entityType, e.entityId, JSON.stringify(e.data), createdAt.toISOString(), prevHash, hash, CURRENT_FORM, actor ? JSON.stringify(actor) : null].forEach((v, c) => cols[c]!.push(v))
    prevHash = hash
  }
  await q(`INSERT INTO audit_events ("workshopId", "vehicleId", "actorId", action, "entityType", "entityId", data, "createdAt", "prevHash", hash, form, actor)
    SELECT w, v, a, act, et, ei, d, c, p, h, f, ac FROM unnest($1::int[], $2::int[], $3::int[], $4::text[], $5::text[], $6::text[], $7::jsonb[], $8::timestamptz[], $9::text[], $10::text[], $11::smallint[], $12::jsonb[])
      WITH ORDINALITY AS t(w, v, a, act, et, ei, d, c, p, h, f, ac, ord) ORDER BY ord`, cols)
  await q('COMMIT')
  written += size
  process.stdout.write(`\r[seed:big] ${written.toLocaleString('en-GB')} of ${EVENTS.toLocaleString('en-GB')} events`)
}
// Fresh statistics for the tables just filled: until autovacuum gets to them the planner guesses from the
// empty tables and reads a car's history about five times slower. The database's owner may analyse them all.
await q('ANALYZE workshops, users, vehicles, audit_events')
const seconds = (performance.now() - started) / 1000
const [total] = await q<{ n: string }>('SELECT count(*) AS n FROM audit_events WHERE "workshopId" = $1', [w.id])
console.log(`\n[seed:big] workshop ${w.id} "${WORKSHOP}": ${w.cars.length} cars, ${Number(total!.n).toLocaleString('en-GB')} events in its chain; wrote ${written.toLocaleString('en-GB')} in ${seconds.toFixed(1)} s`)
console.log('[seed:big] sign in as auditor@ledger.voltwright.test with the demo password to look at it')
await db.end()
