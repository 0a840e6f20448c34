// `npm run bench:fleet`: fleet search and a full re-check with 10,000 cars, beside the same search run bare
// against PostgreSQL; written to bench/FLEET.md. Its own stack (ports and data folder can be set from the
// environment as for `npm start`); the 10,000 cars are seeded once and kept.
import { mkdirSync, writeFileSync } from 'node:fs'
import { loadavg, cpus } from 'node:os'
import { join } from 'node:path'
import { root, stackConfig } from './lib/config.mjs'
import { run, shutdown } from './lib/processes.mjs'
import { psql } from './lib/postgres.mjs'
import { bringUp } from './lib/stack.mjs'

const config = stackConfig({ PORT: 3070, DATA_DIR: '.bench-fleet-data', PG_PORT: 54369, S3_PORT: 4609, SMTP_PORT: 1065, MAIL_WEB_PORT: 1120 })
const CARS = Number(process.env.BENCH_CARS || 10_000)
const DURATION = Number(process.env.BENCH_SECONDS || 10)
const CONNECTIONS = 8
const sql = (text) => psql(config.pgPort, text, 'voltwright')
const bin = (name) => join(root, 'node_modules', '.bin', name)
const ms = (x) => (x === null ? '–' : `${x.toFixed(1)} ms`)

// Three conditions: rear-driven, lift-off deceleration above the snow grip limit, kerb mass under 1,200 kg.
const conditions = [
  { field: 'spec.drivenAxle', op: 'eq', value: 'rear' },
  { field: 'figure.liftOffOverSnowGripMs2', op: 'gt', value: 0 },
  { field: 'spec.kerbMassKg', op: 'lt', value: 1200 }
]
// The SQL the product runs for that search (server/utils/fleet/search.ts), written out for the bare side:
// one statement, the conditions once over typed columns, the total counted from the matches, the page joined.
const bareQueries = [
  `WITH m AS MATERIALIZED (
     SELECT e."profileId", e."vehicleId", e."versionId", e.warnings, COALESCE(v."stockRef"::text, '') AS k, v."specDrivenAxle" AS v0, e."liftOffOverSnowGripMs2" AS v1, v."specKerbMassKg" AS v2
       FROM on_car_evaluations e JOIN vehicles v ON v.id = e."vehicleId" JOIN platforms pl ON pl.id = v."platformId"
      WHERE e."workshopId" = $1 AND v."specDrivenAxle" = 'rear' AND e."liftOffOverSnowGripMs2" > 0 AND v."specKerbMassKg" < 1200),
   page AS (SELECT * FROM m WHERE true ORDER BY m.k ASC, m."profileId" ASC LIMIT 51)
   SELECT c.total, page.*, page.k::text AS "sortKey", x.*
     FROM (SELECT count(*) AS total FROM m) c LEFT JOIN page ON true
     LEFT JOIN LATERAL (SELECT v."stockRef", v.make, v.model, v.year, v.status, pl.name AS "driveUnit", p.name AS "profileName", pv."versionNo"
       FROM vehicles v JOIN platforms pl ON pl.id = v."platformId" JOIN profiles p ON p.id = page."profileId" JOIN profile_versions pv ON pv.id = page."versionId"
      WHERE v.id = page."vehicleId" LIMIT 1) x ON true
    ORDER BY page.k ASC, page."profileId" ASC`
]

function addFleet(env) {
  run(bin('tsx'), [join(root, 'scripts', 'seed-fleet.ts'), '--cars', String(CARS)], { cwd: root, env })
}

async function signIn(email) {
  const res = await fetch(`${config.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', origin: config.baseUrl }, body: JSON.stringify({ email, password: 'voltwright-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}`)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

// The bare side: the statement per request on a pg Pool, CONNECTIONS at a time, every latency kept.
async function bare(env, workshopId, percentile) {
  const pg = (await import('pg')).default
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: CONNECTIONS })
  const latencies = []
  const until = Date.now() + DURATION * 1000
  await Promise.all(Array.from({ length: CONNECTIONS }, async () => {
    while (Date.now() < until) {
      const t0 = performance.now()
      await Promise.all(bareQueries.map(text => pool.query(text, [workshopId])))
      latencies.push(performance.now() - t0)
    }
  }))
  await pool.end()
  latencies.sort((a, b) => a - b)
  return { requests: latencies.length, reqPerSec: latencies.length / DURATION, p50: percentile(latencies, 50), p95: percentile(latencies, 95), p99: percentile(latencies, 99) }
}

try {
  const { env } = await bringUp(config, { afterSeed: (e) => { if (Number(sql(`SELECT count(*) FROM vehicles v JOIN workshops w ON w.id = v."workshopId" WHERE w.name = 'Harrow Fleet Conversions'`)) < CARS) addFleet(e) } })
  const { measure, percentile } = await import('./lib/load.mjs')
  const workshopId = Number(sql(`SELECT id FROM workshops WHERE name = 'Harrow Fleet Conversions'`))
  const cookie = await signIn('engineer@harrow.voltwright.test')
  const headers = { cookie, 'content-type': 'application/json', origin: config.baseUrl }
  const body = JSON.stringify({ conditions })
  const first = await fetch(`${config.baseUrl}/api/fleet/search`, { method: 'POST', headers, body })
  if (!first.ok) throw new Error(`search answered ${first.status}: ${(await first.text()).slice(0, 200)}`)
  const found = (await first.json()).total
  const load = { before: loadavg() }
  await measure({ url: `${config.baseUrl}/api/fleet/search`, method: 'POST', headers, body, connections: 2, duration: 2 }) // warm-up
  const product = await measure({ url: `${config.baseUrl}/api/fleet/search`, method: 'POST', headers, body, connections: CONNECTIONS, duration: DURATION })
  console.log(`[bench:fleet] search: ${product.requests} requests, p50 ${ms(product.p50)}, p95 ${ms(product.p95)}, ${product.non2xx} non-2xx`)
  const floor = await bare(env, workshopId, percentile)
  console.log(`[bench:fleet] bare SQL: ${floor.requests} requests, p50 ${ms(floor.p50)}, p95 ${ms(floor.p95)}`)

  const t0 = Date.now()
  const started = await fetch(`${config.baseUrl}/api/fleet/recheck`, { method: 'POST', headers, body: '{}' })
  if (started.status !== 202) throw new Error(`re-check answered ${started.status}`)
  const { id, total } = await started.json()
  let state
  do {
    await new Promise(r => setTimeout(r, 500))
    state = await (await fetch(`${config.baseUrl}/api/fleet/recheck`, { headers })).json()
  } while (!(state.id === id && state.state === 'done') && Date.now() - t0 < 30 * 60_000)
  const recheckS = (Date.now() - t0) / 1000
  console.log(`[bench:fleet] re-check of ${total} cars: ${recheckS.toFixed(1)} s (${state.state})`)

  mkdirSync(join(root, 'bench'), { recursive: true })
  writeFileSync(join(root, 'bench', 'FLEET.md'), `# Fleet search and re-check with ${total.toLocaleString('en-GB')} cars

Measured by \`npm run bench:fleet\` on ${new Date().toISOString()} against the built server (NODE_ENV=production, one process):
a workshop of ${CARS.toLocaleString('en-GB')} cars, each with one profile of five versions, the fifth on the car with its evaluation kept
(scripts/seed-fleet.ts), beside the demo data.

## Search

\`POST /api/fleet/search\` with three conditions (rear-driven; lift-off deceleration at 50 km/h above the snow grip
limit; kerb mass under 1,200 kg), first page of 50 with the total (${found.toLocaleString('en-GB')} cars match), autocannon with
${CONNECTIONS} connections for ${DURATION} s; every response's latency kept and the percentiles taken from them.
The bare side runs the same statement the product runs (matches, total and page in one) on a \`pg\` Pool of ${CONNECTIONS}, ${CONNECTIONS} at a time, for the same time.

| | requests | req/s | p50 | p95 | p99 | non-2xx |
|---|---|---|---|---|---|---|
| product | ${product.requests} | ${Math.round(product.reqPerSec)} | ${ms(product.p50)} | ${ms(product.p95)} | ${ms(product.p99)} | ${product.non2xx} |
| bare SQL | ${floor.requests} | ${Math.round(floor.reqPerSec)} | ${ms(floor.p50)} | ${ms(floor.p95)} | ${ms(floor.p99)} | – |

Aim: p95 under 100 ms — ${product.p95 !== null && product.p95 < 100 && product.non2xx === 0 ? 'met' : '**not met**'}.

## Re-check

A full re-check of the ${total.toLocaleString('en-GB')} cars (\`POST /api/fleet/recheck\`, then reading \`GET /api/fleet/recheck\`
every 0.5 s until done): **${recheckS.toFixed(1)} s** (state ${state.state}). Each car is evaluated again, its result and its
on-car evaluation written, and an event appended to its history. Aim: under 60 s — ${state.state === 'done' && recheckS < 60 ? 'met' : '**not met**'}.

Machine: ${cpus().length} CPUs (${cpus()[0]?.model ?? 'unknown'}), Node ${process.version}. Load average (1, 5, 15 min) before:
${load.before.map(l => l.toFixed(2)).join(', ')}; after: ${loadavg().map(l => l.toFixed(2)).join(', ')}. Other engineers' builds and
tests share this machine, so the figures vary from run to run.
`)
  console.log('[bench:fleet] written to bench/FLEET.md')
  await shutdown(0)
} catch (e) {
  console.error(`[bench:fleet] FAILED: ${e.message}`)
  await shutdown(1)
}
