// Cars, approved versions and road tests for the road-test API tests. Until the versions API is on main,
// approved versions are written by SQL as the application's role, hashed as every version is.
import { createHash } from 'node:crypto'
import { canonicalJson } from '../../shared/utils/canonical-json'
import { defaultParameters, findPlatform } from '../../shared/platforms/index'
import { baseUrl, type Caller, unique, withDatabase } from './helpers'

export const testSpec = {
  kerbMassKg: 1050, frontAxleLoadPct: 50, wheelbaseMm: 2400, cgHeightMm: 500, tyreSize: '165/80 R15 86S',
  finalDriveRatio: 7.5, drivetrainEfficiency: 0.9, dragCoefficient: 0.42, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.01,
  drivenAxle: 'rear', originalEnginePowerKw: 55, packNominalVoltageV: 350, packCapacityKwh: 30,
  packMaxChargeCurrentA: 100, packMaxDischargeCurrentA: 300, chargerPowerKw: 7
}
export const PLATFORM = 'marrick-110'

export async function newCar(tuner: Caller, extra: Record<string, unknown> = {}): Promise<{ id: number, stockRef: string }> {
  const res = await tuner.call('POST', '/api/vehicles', { stockRef: unique('RT').slice(0, 20), make: 'Testwick', model: 'Road Saloon', year: 1967, platformKey: PLATFORM, spec: testSpec, ...extra })
  if (res.status !== 201) throw new Error(`car: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body
}

const idOf = (email: string) => withDatabase(async c => (await c.query('SELECT id, "workshopId" FROM users WHERE email = $1', [email])).rows[0] as { id: number, workshopId: number })

export async function newProfile(vehicleId: number): Promise<number> {
  return withDatabase(async (c) => {
    const v = (await c.query('SELECT "workshopId" FROM vehicles WHERE id = $1', [vehicleId])).rows[0]
    return (await c.query('INSERT INTO profiles ("workshopId", "vehicleId", name) VALUES ($1, $2, $3) RETURNING id', [v.workshopId, vehicleId, unique('Road')])).rows[0].id
  })
}

// Adds the next version of a profile, approved by the engineer (a review row as the review would write).
export async function approvedVersion(profileId: number, o: { author?: string, reviewer?: string, parameters?: Record<string, number>, state?: string } = {}): Promise<number> {
  const author = await idOf(o.author ?? 'tuner@voltwright.test')
  const reviewer = await idOf(o.reviewer ?? 'engineer@voltwright.test')
  const parameters = { ...defaultParameters(findPlatform(PLATFORM)!), ...o.parameters }
  return withDatabase(async (c) => {
    await c.query('BEGIN')
    await c.query('SELECT 1 FROM profiles WHERE id = $1 FOR UPDATE', [profileId])
    const next = Number((await c.query('SELECT coalesce(max("versionNo"), 0) + 1 AS n FROM profile_versions WHERE "profileId" = $1', [profileId])).rows[0].n)
    const content = { profileId, versionNo: next, parentVersionId: null, parameters, rationale: 'Test settings', authorId: author.id, origin: 'workshop' }
    const hash = createHash('sha256').update(canonicalJson(content)).digest('hex')
    const state = o.state ?? 'approved'
    const id = (await c.query(`INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", "parentVersionId", parameters, rationale, "authorId", state, origin, "contentHash", "submittedAt", "decidedAt", justifications)
      VALUES ($1, $2, $3, NULL, $4, $5, $6, $7, 'workshop', $8, now(), now(), $9) RETURNING id`,
    [author.workshopId, profileId, next, JSON.stringify(parameters), content.rationale, author.id, state, hash, JSON.stringify({ 'stop-lamp': 'Stop lamps wired to the regen signal and checked.' })])).rows[0].id
    if (state === 'approved') await c.query('INSERT INTO reviews ("workshopId", "versionId", "reviewerId", decision, comment) VALUES ($1, $2, $3, \'approve\', \'Fine\')', [author.workshopId, id, reviewer.id])
    await c.query('COMMIT')
    return id
  })
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
  checks: o.checks ?? passingChecks(), verdict: o.verdict ?? 'pass'
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
