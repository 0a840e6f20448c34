// Median time of the diff route with the demo data: two evaluations and the diff, over HTTP against the
// running product. Start it first (npm start), then: npm run bench:diff [-- http://localhost:3000]
import { Bench } from 'tinybench'

const BUDGET_MS = 20
const base = process.argv[2] ?? process.env.VOLTWRIGHT_BASE_URL ?? 'http://localhost:3000'

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password: 'voltwright-demo' }) }).catch(() => null)
  if (!res?.ok) throw new Error(`Could not sign in at ${base} (${res?.status ?? 'no answer'}): start the product with npm start first.`)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

const cookie = await signIn('engineer@voltwright.test')
const get = async <T>(path: string): Promise<T> => {
  const res = await fetch(`${base}${path}`, { headers: { cookie } })
  if (!res.ok) throw new Error(`GET ${path} answered ${res.status}`)
  return res.json() as Promise<T>
}

// The engineer's case: a version awaiting review against the one on the car (or its parent).
const reviews = await get<{ items: { versionId: number }[] }>('/api/worklist/reviews')
let pair: { a: number, b: number } | null = null
for (const r of reviews.items) {
  const v = await get<{ id: number, parentVersionId: number | null, profile: { onCarVersionId: number | null } }>(`/api/versions/${r.versionId}`)
  const against = v.profile.onCarVersionId ?? v.parentVersionId
  if (against) { pair = { a: against, b: v.id }; break }
}
if (!pair) throw new Error('No version awaiting review has an on-car version or a parent to compare with: seed the demo data first.')
const path = `/api/versions/${pair.a}/diff/${pair.b}`
const sample = await get<{ rows: unknown[], patch: unknown[] }>(path)

const bench = new Bench({ time: 3000, warmupTime: 500 })
bench.add(`GET ${path}`, async () => {
  const res = await fetch(`${base}${path}`, { headers: { cookie } })
  await res.arrayBuffer()
})
// The same round trip to a route that does nothing, to tell the diff's own cost from the machine's.
bench.add('GET /api/health', async () => {
  const res = await fetch(`${base}/api/health`)
  await res.arrayBuffer()
})
await bench.run()

const latency = (i: number) => {
  const result = bench.tasks[i]?.result
  if (!result || !('latency' in result)) throw new Error('The benchmark did not complete')
  return result.latency
}
const diff = latency(0)
const health = latency(1)
const p50 = diff.p50!
console.log(`diff ${path} (${sample.rows.length} settings, ${sample.patch.length} patch operations): median ${p50.toFixed(2)} ms, p99 ${diff.p99!.toFixed(2)} ms over ${diff.samplesCount} requests (budget ${BUDGET_MS} ms median)`)
console.log(`health check on the same server, for comparison: median ${health.p50!.toFixed(2)} ms over ${health.samplesCount} requests`)
if (p50 >= BUDGET_MS) {
  console.error('Over budget: make the diff route faster before shipping.')
  process.exitCode = 1
}
