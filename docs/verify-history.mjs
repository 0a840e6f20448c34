// Checks a workshop's history from the outside, with nothing but the HTTP API (docs/history.md, "Checking it
// yourself"). Node 20+ and one package: `npm install canonicalize@4.0.0` (RFC 8785).
// VOLTWRIGHT_EMAIL=… VOLTWRIGHT_PASSWORD=… node verify-history.mjs https://register.example [noted-id:noted-hash]
import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'

const [base, noted] = process.argv.slice(2)
const sha256 = text => createHash('sha256').update(text, 'utf8').digest('hex')
const fail = (message) => { console.log(`NOT OK: ${message}`); process.exit(1) }
const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email: process.env.VOLTWRIGHT_EMAIL, password: process.env.VOLTWRIGHT_PASSWORD }) })
if (!login.ok) fail(`sign-in answered ${login.status}`)
const cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
const events = [] // 1. every event with its hashed record, newest first, 200 a page
for (let cursor = null; ;) {
  const page = await (await fetch(`${base}/api/audit/events?include=record&limit=200${cursor ? `&cursor=${cursor}` : ''}`, { headers: { cookie } })).json()
  events.push(...page.items)
  if (!(cursor = page.nextCursor)) break
}
let prev = null // 2. oldest first: each event links to the one before it, and its record gives its hash
for (const e of events.reverse()) {
  if (e.prevHash !== prev || (e.form === 2 && e.record.prevHash !== prev)) fail(`event ${e.id}: its previous hash is not the hash of the event before it`)
  const hash = e.form === 1 ? sha256((e.prevHash ?? '') + canonicalize(e.record)) : sha256(canonicalize(e.record))
  if (hash !== e.hash) fail(`event ${e.id}: its record does not give its hash`)
  prev = e.hash
}
if (noted && !events.some(e => `${e.id}:${e.hash}` === noted.toLowerCase())) fail(`the noted head ${noted} is not in the chain: events were removed or rewritten`)
console.log(`OK: ${events.length} events; newest ${events.at(-1)?.id}:${events.at(-1)?.hash}`) // 3. note this head
