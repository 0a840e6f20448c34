// `npm run bench`: the product under load beside a bare handler running the same SQL, written to bench/REPORT.md.
// Its own stack on its own ports and a data folder that persists (.bench-data), so the big seed is written once.
import { execFileSync } from 'node:child_process'
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { loadavg, cpus } from 'node:os'
import { join } from 'node:path'
import { root, stackConfig } from './lib/config.mjs'
import { run, startChild, waitForHttp, shutdown } from './lib/processes.mjs'
import { psql } from './lib/postgres.mjs'
import { bringUp } from './lib/stack.mjs'

const config = stackConfig({ PORT: 3050, DATA_DIR: '.bench-data', PG_PORT: 54359, S3_PORT: 4599, SMTP_PORT: 1055, MAIL_WEB_PORT: 1110 })
const floorPort = Number(process.env.FLOOR_PORT || config.port + 1)
const floorBase = `http://127.0.0.1:${floorPort}`
const DURATION = Number(process.env.BENCH_SECONDS || 5)
const ROUNDS = Number(process.env.BENCH_ROUNDS || 3)
const CONNECTIONS = 32
// The aim, against the floor measured in the same run: at least 80 % of its throughput, p95 within 1.25× of its p95.
const RATIO_AIM = 0.8
const P95_AIM = 1.25
const bin = (name) => join(root, 'node_modules', '.bin', name)
const sql = (text) => psql(config.pgPort, text, 'voltwright')

async function signIn(email) {
  const res = await fetch(`${config.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', origin: config.baseUrl }, body: JSON.stringify({ email, password: 'voltwright-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}`)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

async function expectOk(url, init) {
  const res = await fetch(url, init)
  if (!res.ok) throw new Error(`${url} answered ${res.status}: ${(await res.text()).slice(0, 200)}`)
}

const ms = (x) => x === null ? '–' : `${x.toFixed(1)} ms`
const cpuMs = (x) => x === null ? '–' : `${x.toFixed(2)} ms`

// A process's own CPU time so far, in µs: the product's from /proc (Linux), the floor's as it reports it.
// The CPU an answer costs moves less with other work's load than throughput does.
let ticksPerSecond = 100
try { ticksPerSecond = Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' })) || 100 } catch { /* the usual value */ }
function procCpu(pid) {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ')
    return (Number(fields[11]) + Number(fields[12])) * 1e6 / ticksPerSecond
  } catch { return null }
}
const floorCpu = async () => (await (await fetch(`${floorBase}/cpu`)).json()).micros
const rps = (x) => Math.round(x).toLocaleString('en-GB')

const yes = (ok) => ok ? 'met' : '**not met**'
const median = (xs) => [...xs].sort((a, b) => a - b)[xs.length >> 1]
// Each figure the median of the rounds; errors and non-2xx answers summed, so one bad round shows.
const medianRun = (runs) => ({
  cpuMs: runs.some(m => m.cpuMs === null) ? null : median(runs.map(m => m.cpuMs)),
  reqPerSec: median(runs.map(m => m.reqPerSec)), p50: median(runs.map(m => m.p50)), p95: median(runs.map(m => m.p95)), p99: median(runs.map(m => m.p99)),
  non2xx: runs.reduce((n, m) => n + m.non2xx, 0), errors: runs.reduce((n, m) => n + m.errors, 0)
})

function report(rows, load) {
  let latencyMet = 0
  let ratioMet = 0
  const lines = rows.map(({ name, product: p, floor: f, ratio }) => {
    const clean = p.non2xx === 0 && p.errors === 0
    const fast = clean && p.p95 <= P95_AIM * f.p95
    const close = clean && ratio >= RATIO_AIM
    latencyMet += fast ? 1 : 0
    ratioMet += close ? 1 : 0
    return `| ${name} | ${rps(p.reqPerSec)} | ${ms(p.p50)} | ${ms(p.p95)} | ${ms(p.p99)} | ${p.non2xx} | ${rps(f.reqPerSec)} | ${ms(f.p50)} | ${ms(f.p95)} | ${ms(f.p99)} | ${f.non2xx} | ${(ratio * 100).toFixed(0)} % | ${(p.p95 / f.p95).toFixed(2)}× | ${yes(close)} | ${yes(fast)} | ${cpuMs(p.cpuMs)} | ${cpuMs(f.cpuMs)} | ${p.cpuMs && f.cpuMs ? `${(100 * f.cpuMs / p.cpuMs).toFixed(0)} %` : '–'} |`
  })
  return `# Voltwright under load

Measured by \`npm run bench\` on ${new Date().toISOString()}: autocannon, ${CONNECTIONS} connections, ${ROUNDS} rounds of ${DURATION} s per route and side,
product and floor taking turns; each figure is the median of the rounds, the ratio the median of the rounds' ratios,
against the built server (NODE_ENV=production, one process) with the big seed (200,000 audit events in the
"Ledger Hall Conversions" workshop, 200 cars) and the demo data. Latencies are every response's, not autocannon's histogram buckets.

The floor is a bare \`node:http\` handler with a \`pg\` Pool of the same size (10) running the product's SQL for
the same four answers (scripts/bench-floor.ts): no Nuxt, no session, no guard, no validation; evaluate calls
shared/compute \`evaluate\` directly on the car's spec; the diff evaluates both sides and makes the patch, without
the product's row and figure tables. The product's extra cost is the framework, the sealed-session cookie with
its user lookup, zod, the ajv schema check and the fuller answers.

Where the time goes (CPU profiles of the built server under this load): [PROFILE.md](PROFILE.md).

Aim, on each route, against the floor measured in the same run: at least ${RATIO_AIM * 100} % of its throughput, and a p95
within ${P95_AIM}× of its p95.

| Route | Product req/s | p50 | p95 | p99 | non-2xx | Floor req/s | p50 | p95 | p99 | non-2xx | Product / floor | p95 product / floor | ${RATIO_AIM * 100} % of the floor | p95 within ${P95_AIM}× | CPU per answer, product | floor | floor / product CPU |
|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|
${lines.join('\n')}

The throughput aim is met on ${ratioMet} of ${rows.length} routes, the p95 aim on ${latencyMet} of ${rows.length}.

"CPU per answer" is the server process's own CPU time over a round divided by the answers it gave (the
product's read from /proc, the floor's from its own \`process.cpuUsage()\`; the database's share is in
neither). It moves less with the machine's load than throughput does (on this shared sandbox still by up to
half between runs); "floor / product CPU" is the share of
the floor's throughput the product would reach where the Node process alone set the pace.

Machine: ${cpus().length} CPUs (${cpus()[0]?.model ?? 'unknown'}), Node ${process.version}. Load average (1, 5, 15 min)
before the runs: ${load.before.map(l => l.toFixed(2)).join(', ')}; after: ${loadavg().map(l => l.toFixed(2)).join(', ')}.
Other engineers' builds and test suites share this machine, so a high load average here means the figures are
pessimistic and vary from run to run; compare product and floor, measured back to back, rather than absolutes.
`
}

// 200,000 audit events in one workshop, written once and kept in .bench-data.
function addBigSeed(env) {
  const big = Number(sql(`SELECT count(*) FROM audit_events e JOIN workshops w ON w.id = e."workshopId" WHERE w.name = 'Ledger Hall Conversions'`))
  if (big < 200_000) run(bin('tsx'), [join(root, 'scripts', 'seed-big.ts'), '--events', String(200_000 - big)], { cwd: root, env })
  else console.log(`[bench] big seed already in place (${big.toLocaleString('en-GB')} events)`)
}

try {
  const { env, server } = await bringUp(config, { afterSeed: addBigSeed })
  const { measure } = await import('./lib/load.mjs') // autocannon is there only once the dependencies are
  startChild('floor', bin('tsx'), [join(root, 'scripts', 'bench-floor.ts')], { env: { ...env, FLOOR_PORT: String(floorPort) }, cwd: root })
  await waitForHttp(`${floorBase}/health`)

  const ledger = Number(sql(`SELECT id FROM workshops WHERE name = 'Ledger Hall Conversions'`))
  const bigCar = Number(sql(`SELECT "vehicleId" FROM audit_events WHERE "workshopId" = ${ledger} AND "vehicleId" IS NOT NULL GROUP BY 1 ORDER BY count(*) DESC LIMIT 1`))
  const [versionA, versionB, demo] = sql(`SELECT min(id) || ' ' || max(id) || ' ' || min("workshopId") FROM profile_versions GROUP BY "profileId" HAVING count(*) >= 2 ORDER BY "profileId" LIMIT 1`).split(' ').map(Number)
  const demoEmail = sql(`SELECT email FROM users WHERE "workshopId" = ${demo} AND 'engineer' = ANY(roles) AND active ORDER BY id LIMIT 1`)
  const parameters = sql(`SELECT pv.parameters FROM profile_versions pv JOIN profiles p ON p.id = pv."profileId" JOIN vehicles v ON v.id = p."vehicleId" JOIN platforms pl ON pl.id = v."platformId" WHERE pl.key = 'fenlow-45' ORDER BY pv.id LIMIT 1`)
  const evaluateBody = JSON.stringify({ vehicleId: bigCar, platformKey: 'fenlow-45', parameters: JSON.parse(parameters) })

  const ledgerCookie = await signIn('tuner@ledger.voltwright.test')
  const demoCookie = await signIn(demoEmail)
  const json = { 'content-type': 'application/json', origin: config.baseUrl }
  const routes = [
    { name: 'car list `GET /api/vehicles`', product: { url: `${config.baseUrl}/api/vehicles`, headers: { cookie: ledgerCookie } }, floor: { url: `${floorBase}/vehicles?w=${ledger}` } },
    { name: `car history \`GET /api/vehicles/${bigCar}/history?limit=50\``, product: { url: `${config.baseUrl}/api/vehicles/${bigCar}/history?limit=50`, headers: { cookie: ledgerCookie } }, floor: { url: `${floorBase}/vehicles/${bigCar}/history?w=${ledger}` } },
    { name: `version diff \`GET /api/versions/${versionA}/diff/${versionB}\``, product: { url: `${config.baseUrl}/api/versions/${versionA}/diff/${versionB}`, headers: { cookie: demoCookie } }, floor: { url: `${floorBase}/versions/${versionA}/diff/${versionB}?w=${demo}` } },
    { name: 'evaluate `POST /api/evaluate`', product: { url: `${config.baseUrl}/api/evaluate`, method: 'POST', headers: { cookie: ledgerCookie, ...json }, body: evaluateBody }, floor: { url: `${floorBase}/evaluate?w=${ledger}`, method: 'POST', headers: json, body: evaluateBody } }
  ]
  for (const r of routes) { await expectOk(r.product.url, r.product); await expectOk(r.floor.url, r.floor) }

  const load = { before: loadavg() }
  const rows = []
  for (const r of routes) {
    for (const side of ['product', 'floor']) await measure({ ...r[side], connections: 4, duration: 2 }) // warm-up: JIT, pools, caches
    // Product and floor take turns, round after round, so a change in the machine's load falls on both.
    const runs = { product: [], floor: [] }
    for (let round = 0; round < ROUNDS; round++) {
      for (const side of ['product', 'floor']) {
        const cpu = side === 'product' ? async () => procCpu(server.pid) : floorCpu
        const cpuBefore = await cpu()
        const m = await measure({ ...r[side], connections: CONNECTIONS, duration: DURATION })
        const cpuAfter = await cpu()
        m.cpuMs = cpuBefore === null || cpuAfter === null ? null : (cpuAfter - cpuBefore) / 1000 / m.requests
        runs[side].push(m)
        console.log(`[bench] ${r.name} ${side} round ${round + 1}: ${rps(m.reqPerSec)} req/s, p50 ${ms(m.p50)}, p95 ${ms(m.p95)}, p99 ${ms(m.p99)}, ${m.non2xx} non-2xx, CPU ${cpuMs(m.cpuMs)} per answer`)
      }
    }
    const ratios = runs.product.map((p, i) => p.reqPerSec / runs.floor[i].reqPerSec)
    rows.push({ name: r.name, product: medianRun(runs.product), floor: medianRun(runs.floor), ratio: median(ratios) })
  }
  mkdirSync(join(root, 'bench'), { recursive: true })
  writeFileSync(join(root, 'bench', 'REPORT.md'), report(rows, load))
  console.log('[bench] written to bench/REPORT.md')
  await shutdown(0)
} catch (e) {
  console.error(`[bench] FAILED: ${e.message}`)
  await shutdown(1)
}
