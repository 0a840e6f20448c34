// With the big seed in place (npm run seed:big) and the server running: `npm run bench:history`
// [BASE_URL=http://localhost:3000]. Measures a page of 50 from a car's history (budget: p95 under 30 ms)
// and the chain verifier (budget: at least 20,000 events a second), through the real HTTP API.
import autocannon from 'autocannon'

const base = process.env.BASE_URL ?? 'http://localhost:3000'
const PAGE_BUDGET_MS = 30
const VERIFY_BUDGET_PER_S = 20_000

async function signIn(email: string) {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password: 'voltwright-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}: run npm run seed:big first`)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}
const cookie = await signIn('auditor@ledger.voltwright.test')
const get = async <T>(path: string): Promise<T> => {
  const res = await fetch(`${base}${path}`, { headers: { cookie } })
  if (!res.ok) throw new Error(`${path} answered ${res.status}`)
  return res.json() as Promise<T>
}

// Pages across several cars, first pages and deep ones, so the cache of one page does not flatter the figure.
const cars = (await get<{ items: { id: number }[] }>('/api/vehicles?pageSize=100')).items.slice(0, 20)
const paths: string[] = []
let events = 0
for (const car of cars.slice(0, 5)) {
  let cursor: string | null = null
  for (let page = 0; page < 8; page++) {
    const path = `/api/vehicles/${car.id}/history?limit=50${cursor ? `&cursor=${cursor}` : ''}`
    paths.push(path)
    const body: { items: unknown[], nextCursor: string | null } = await get(path)
    events += body.items.length
    if (!body.nextCursor) break
    cursor = body.nextCursor
  }
}
for (const car of cars.slice(5)) paths.push(`/api/vehicles/${car.id}/history?limit=50`, `/api/vehicles/${car.id}/history?limit=50&action=version.`)

function percentile(xs: number[], p: number) {
  const sorted = [...xs].sort((a, b) => a - b)
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!
}

async function load(connections: number, amount: number, pool = paths) {
  const times: number[] = []
  let i = 0
  const instance = autocannon({
    url: base, connections, amount, headers: { cookie },
    requests: [{ setupRequest: (req: Record<string, unknown>) => ({ ...req, method: 'GET', path: pool[i++ % pool.length] }) }]
  })
  instance.on('response', (_c: unknown, status: number, _b: unknown, ms: number) => { if (status === 200) times.push(ms) })
  const result = await instance
  return { times, errors: result.non2xx + result.errors, rps: result.requests.average }
}

await load(2, 200) // warm-up
// For scale: the plainest signed-in read there is, on the same machine at the same moment.
const plain = await load(1, 1000, cars.map(c => `/api/vehicles/${c.id}`))
console.log(`for scale, GET /api/vehicles/:id, 1 connection: p50 ${percentile(plain.times, 50).toFixed(1)} ms, p95 ${percentile(plain.times, 95).toFixed(1)} ms`)
for (const connections of [1, 8]) {
  const { times, errors, rps } = await load(connections, 2000)
  const p95 = percentile(times, 95)
  console.log(`history page of 50, ${connections} connection(s): p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${p95.toFixed(1)} ms, p99 ${percentile(times, 99).toFixed(1)} ms over ${times.length} requests (${Math.round(rps)} req/s, ${errors} not OK)`)
  if (connections === 1 && p95 >= PAGE_BUDGET_MS) process.exitCode = 1
}

const rates: number[] = []
let checked = 0
for (let run = 0; run < 3; run++) {
  const started = performance.now()
  const v = await get<{ ok: boolean, checked: number, durationMs: number }>('/api/audit/verify')
  const wall = performance.now() - started
  checked = v.checked
  rates.push(v.checked / (wall / 1000))
  console.log(`verify run ${run + 1}: ${v.ok ? 'intact' : 'BROKEN'}, ${v.checked.toLocaleString('en-GB')} events in ${(wall / 1000).toFixed(2)} s (server ${v.durationMs} ms) = ${Math.round(v.checked / (wall / 1000)).toLocaleString('en-GB')} events/s`)
}
const best = Math.max(...rates)
console.log(`verify: best ${Math.round(best).toLocaleString('en-GB')} events/s over ${checked.toLocaleString('en-GB')} events (budget ${VERIFY_BUDGET_PER_S.toLocaleString('en-GB')}/s); ${events} events read while collecting cursors`)
if (best < VERIFY_BUDGET_PER_S) process.exitCode = 1
