// Cars, approved versions and road tests for the road-test API tests, made through the versions API itself.
import { createHash } from 'node:crypto'
import { defaultParameters, findPlatform } from '../../shared/platforms/index'
import { baseUrl, type Caller, signIn, unique } from './helpers'
import { newProfile as newProfileWithDraft, submitAndApprove, testSpec } from './version-fixtures'

export { testSpec }
export const PLATFORM = 'marrick-110'
const TUNER = 'tuner@voltwright.test'

export async function newCar(tuner: Caller, extra: Record<string, unknown> = {}): Promise<{ id: number, stockRef: string }> {
  const res = await tuner.call('POST', '/api/vehicles', { stockRef: unique('RT').slice(0, 20), make: 'Testwick', model: 'Road Saloon', year: 1967, platformKey: PLATFORM, spec: testSpec, ...extra })
  if (res.status !== 201) throw new Error(`car: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body
}

const sessions = new Map<string, Promise<Caller>>()
const as = (email: string) => {
  if (!sessions.has(email)) sessions.set(email, signIn(email))
  return sessions.get(email)!
}
// A new profile's first version, a draft of the demo tuner's, until approvedVersion takes it up.
const firstDrafts = new Map<number, number>()

export async function newProfile(vehicleId: number): Promise<number> {
  const first = await newProfileWithDraft(await as(TUNER), vehicleId, { parameters: defaultParameters(findPlatform(PLATFORM)!), rationale: 'Test settings' })
  firstDrafts.set(first.profileId, first.id)
  return first.profileId
}

// The profile's next version, submitted by its author and approved by another engineer (or left in review).
export async function approvedVersion(profileId: number, o: { author?: string, reviewer?: string, parameters?: Record<string, number>, state?: 'approved' | 'in-review' } = {}): Promise<number> {
  const author = await as(o.author ?? TUNER)
  const parameters = { ...defaultParameters(findPlatform(PLATFORM)!), ...o.parameters }
  const draft = (o.author ?? TUNER) === TUNER ? firstDrafts.get(profileId) : undefined
  let id: number
  if (draft) {
    firstDrafts.delete(profileId)
    const { lockVersion } = (await author.call('GET', `/api/versions/${draft}`)).body
    const saved = await author.call('PATCH', `/api/versions/${draft}`, { lockVersion, parameters })
    if (saved.status !== 200) throw new Error(`draft: ${saved.status} ${JSON.stringify(saved.body)}`)
    id = draft
  } else {
    const created = await author.call('POST', `/api/profiles/${profileId}/versions`, { parameters, rationale: 'Test settings' })
    if (created.status !== 201) throw new Error(`version: ${created.status} ${JSON.stringify(created.body)}`)
    id = created.body.id
  }
  await submitAndApprove(author, o.state === 'in-review' ? null : await as(o.reviewer ?? 'engineer@voltwright.test'), id)
  return id
}

// A new car on another drive unit with an approved version of that unit's default settings.
export async function approvedVersionOn(platformKey: string, model: string): Promise<{ car: { id: number, stockRef: string }, versionId: number }> {
  const tuner = await as(TUNER)
  const car = await newCar(tuner, { platformKey, model })
  const draft = await newProfileWithDraft(tuner, car.id, { parameters: defaultParameters(findPlatform(platformKey)!), rationale: 'Test settings' })
  await submitAndApprove(tuner, await as('engineer@voltwright.test'), draft.id)
  return { car, versionId: draft.id }
}

export const passingChecks = () => [
  { key: 'hill-start', verdict: 'pass', values: { gradientPct: 18, rollbackMm: 60 }, note: 'Quarry Lane, both directions' },
  { key: 'lift-off-regen', verdict: 'pass', values: { feel: 'gentle' }, note: '' },
  { key: 'brake-regen', verdict: 'pass', values: {}, note: '' },
  { key: 'creep', verdict: 'pass', values: { speedKph: 5 }, note: '' },
  { key: 'full-power', verdict: 'pass', values: { peakSpeedKph: 96 }, note: '' },
  { key: 'thermal-soak', verdict: 'pass', values: { motorC: 74, inverterC: 58, batteryC: 31 }, note: 'After 40 min' }
]

export const roadTestBody = (o: { checks?: unknown[], verdict?: string } = {}) => ({
  conditions: { surface: 'dry', ambientC: 14, route: 'Forge loop with Quarry Lane' },
  checks: o.checks ?? passingChecks(), verdict: o.verdict ?? 'pass', preDriveConfirmed: true
})

export async function recordRoadTest(tester: Caller, versionId: number, o: { checks?: unknown[], verdict?: string } = {}): Promise<number> {
  const res = await tester.call('POST', `/api/versions/${versionId}/road-tests`, roadTestBody(o))
  if (res.status !== 201) throw new Error(`road test: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body.id
}

// A multipart body with one file in the field "file".
export function multipart(bytes: Buffer | string, filename: string, type: string) {
  const form = new FormData()
  form.append('file', new Blob([typeof bytes === 'string' ? Buffer.from(bytes) : bytes], { type }), filename)
  return form
}

export async function upload(caller: Caller, path: string, body: FormData | Buffer | string, headers: Record<string, string> = {}) {
  const res = await fetch(`${baseUrl}${path}`, { method: 'POST', headers: { cookie: caller.cookie, origin: baseUrl, ...headers }, body: body as BodyInit })
  const text = await res.text()
  let parsed: any = text
  try { parsed = JSON.parse(text) } catch { /* not JSON */ }
  return { status: res.status, body: parsed, headers: res.headers }
}

export const sha256 = (b: Buffer | string) => createHash('sha256').update(b).digest('hex')

// A car owner of their own, so that the demo client's two cars stay two.
export async function newClient(admin: Caller): Promise<{ id: number, email: string }> {
  const email = `${unique('owner')}@voltwright.test`
  const res = await admin.call('POST', '/api/users', { email, name: 'Ottoline Marsh', roles: ['client'], password: 'owner-password-123' })
  if (res.status !== 201) throw new Error(`owner: ${res.status} ${JSON.stringify(res.body)}`)
  return { id: res.body.id, email }
}
