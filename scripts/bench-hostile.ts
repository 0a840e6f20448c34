// How long the evaluate route takes over bodies an attacker might send (docs/security.md, "Settings and evaluate bodies"):
// long and many setting names, deep nesting, a megabyte, `__proto__`, beside a normal body; 20 of each, one
// at a time, timed from the client. Start the product first (npm start), then:
// npm run bench:hostile [-- http://localhost:3000]
import { loadavg } from 'node:os'

const BUDGET_MS = 50
const RUNS = 20
const base = process.argv[2] ?? process.env.VOLTWRIGHT_BASE_URL ?? 'http://localhost:3000'

const signIn = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: 'tuner@voltwright.test', password: 'voltwright-demo' }) }).catch(() => null)
if (!signIn?.ok) throw new Error(`Could not sign in at ${base} (${signIn?.status ?? 'no answer'}): start the product with npm start first.`)
const cookie = signIn.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
const getJson = async <T>(path: string): Promise<T> => (await fetch(`${base}${path}`, { headers: { cookie } })).json() as Promise<T>

const cars = await getJson<{ items: { id: number, platform: { key: string } | null }[] }>('/api/vehicles?pageSize=100')
const car = cars.items.find(c => c.platform)
if (!car) throw new Error('No car with a drive unit: seed the demo data first.')
const unit = await getJson<{ schema: { properties: Record<string, { default?: unknown }> } }>(`/api/platforms/${car.platform!.key}`)
const defaults = Object.fromEntries(Object.entries(unit.schema.properties).map(([k, p]) => [k, p.default]))
const body = (parameters: unknown) => JSON.stringify({ vehicleId: car.id, platformKey: car.platform!.key, parameters })

const longNames: Record<string, unknown> = { ...defaults }
for (let i = 0; i < 40; i++) longNames[`${'a'.repeat(96)}${i}b`] = 1
const manyKeys: Record<string, number> = {}
for (let i = 0; i < 10_000; i++) manyKeys[`s${i}`] = 0
const bodies: Record<string, string> = {
  'normal settings': body(defaults),
  '40 names of 100 characters': body(longNames),
  '10,000 setting names': body(manyKeys),
  'nested 15,000 deep': `{"vehicleId":${car.id},"platformKey":"${car.platform!.key}","parameters":{"x":${'['.repeat(15_000)}${']'.repeat(15_000)}}}`,
  'one value of 1 MB': body({ x: 'y'.repeat(1_000_000) }),
  '__proto__ as a name': `{"vehicleId":${car.id},"platformKey":"${car.platform!.key}","parameters":{"__proto__":{"polluted":1}}}`
}

console.log(`load average before: ${loadavg().map(l => l.toFixed(2)).join(', ')}`)
let worst = 0
for (const [name, text] of Object.entries(bodies)) {
  const times: number[] = []
  const statuses = new Set<number>()
  for (let i = -2; i < RUNS; i++) { // the first two warm up (the drive unit's validator is compiled once)
    const t = performance.now()
    const res = await fetch(`${base}/api/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base, cookie }, body: text })
    await res.arrayBuffer()
    if (i < 0) continue
    times.push(performance.now() - t)
    statuses.add(res.status)
  }
  times.sort((a, b) => a - b)
  worst = Math.max(worst, times.at(-1)!)
  console.log(`${name.padEnd(28)} ${String(text.length).padStart(9)} bytes  answered ${[...statuses].join('/')}  median ${times[RUNS >> 1]!.toFixed(1)} ms  max ${times.at(-1)!.toFixed(1)} ms`)
}
console.log(`load average after: ${loadavg().map(l => l.toFixed(2)).join(', ')}`)
console.log(`slowest single answer ${worst.toFixed(1)} ms (budget ${BUDGET_MS} ms): ${worst <= BUDGET_MS ? 'within' : 'OVER'}`)
