// What the history tests need that other parts of the product create (profiles, signed-off versions, road
// tests, snags, a second workshop), made directly in SQL as the application's role.
import { createHash } from 'node:crypto'
import { defaultParameters, findPlatform } from '../../shared/platforms'
import { canonicalJson } from '../../shared/utils/canonical-json'
import { withDatabase, unique, type Caller } from './helpers'

export const testSpec = {
  kerbMassKg: 1050, frontAxleLoadPct: 50, wheelbaseMm: 2400, cgHeightMm: 500, tyreSize: '165/80 R15 86S',
  finalDriveRatio: 7.5, drivetrainEfficiency: 0.9, dragCoefficient: 0.42, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.01,
  drivenAxle: 'rear', originalEnginePowerKw: 55, packNominalVoltageV: 350, packCapacityKwh: 30,
  packMaxChargeCurrentA: 100, packMaxDischargeCurrentA: 300, chargerPowerKw: 7
}

export async function newCar(as: Caller, extra: Record<string, unknown> = {}) {
  const res = await as.call('POST', '/api/vehicles', { stockRef: unique('XH').slice(0, 20), make: 'Testwick', model: 'Ledger Saloon', year: 1966, platformKey: 'fenlow-45', spec: testSpec, ...extra })
  if (res.status !== 201) throw new Error(`creating a car answered ${res.status}: ${JSON.stringify(res.body)}`)
  return res.body as { id: number, stockRef: string, workshopId?: number }
}

export const userId = (email: string) => withDatabase(async c => (await c.query('SELECT id FROM users WHERE email = $1', [email])).rows[0].id as number)

export const fenlowParameters = () => ({ ...defaultParameters(findPlatform('fenlow-45')!) }) as Record<string, number>

// A profile whose version 1 is signed off and on the car, optionally with a passing road test.
export async function addOnCarProfile(vehicleId: number, options: { name?: string, parameters?: Record<string, number>, roadTest?: 'pass' | 'fail' } = {}) {
  const parameters = options.parameters ?? fenlowParameters()
  const [author, tester] = await Promise.all([userId('tuner@voltwright.test'), userId('tester@voltwright.test')])
  return withDatabase(async (c) => {
    const { workshopId } = (await c.query('SELECT "workshopId" FROM vehicles WHERE id = $1', [vehicleId])).rows[0]
    const profileId = (await c.query('INSERT INTO profiles ("workshopId", "vehicleId", name) VALUES ($1, $2, $3) RETURNING id', [workshopId, vehicleId, options.name ?? 'Road'])).rows[0].id
    const contentHash = createHash('sha256').update(canonicalJson(parameters)).digest('hex')
    const versionId = (await c.query(`INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, rationale, "authorId", state, "contentHash", "submittedAt", "decidedAt")
      VALUES ($1, $2, 1, $3, 'First road setting', $4, 'signed-off', $5, now(), now()) RETURNING id`, [workshopId, profileId, JSON.stringify(parameters), author, contentHash])).rows[0].id
    await c.query('UPDATE profiles SET "onCarVersionId" = $1 WHERE id = $2', [versionId, profileId])
    let roadTestId: number | null = null
    if (options.roadTest) {
      roadTestId = (await c.query(`INSERT INTO road_tests ("workshopId", "vehicleId", "versionId", "testerId", "testedAt", conditions, checks, verdict)
        VALUES ($1, $2, $3, $4, '2026-11-20T10:00:00Z', $5, '[]', $6) RETURNING id`, [workshopId, vehicleId, versionId, tester, JSON.stringify({ surface: 'wet', ambientC: 9, route: 'Quarry hill loop' }), options.roadTest])).rows[0].id
    }
    return { profileId: profileId as number, versionId: versionId as number, roadTestId, parameters }
  })
}

export async function addSnag(vehicleId: number, kind: 'conversion' | 'remedial' | 'enhancement', title: string, status = 'open') {
  const author = await userId('tester@voltwright.test')
  return withDatabase(async (c) => {
    const { workshopId } = (await c.query('SELECT "workshopId" FROM vehicles WHERE id = $1', [vehicleId])).rows[0]
    return (await c.query(`INSERT INTO snags ("workshopId", "vehicleId", kind, title, detail, status, "createdById") VALUES ($1, $2, $3, $4, 'Found on the road test', $5, $6) RETURNING id`,
      [workshopId, vehicleId, kind, title, status, author])).rows[0].id as number
  })
}

// A workshop of its own, so that a test may break its chain without touching anyone else's.
export async function addWorkshop(roles: Record<string, string[]>) {
  return withDatabase(async (c) => {
    const hash = (await c.query('SELECT "passwordHash" FROM users WHERE email = $1', ['admin@voltwright.test'])).rows[0].passwordHash
    const workshopId = (await c.query(`INSERT INTO workshops (name, settings) VALUES ($1, '{}') RETURNING id`, [unique('Test bay')])).rows[0].id as number
    const emails: Record<string, string> = {}
    for (const [key, r] of Object.entries(roles)) {
      emails[key] = `${unique(key)}@bay.voltwright.test`
      await c.query('INSERT INTO users ("workshopId", email, name, "passwordHash", roles) VALUES ($1, $2, $3, $4, $5)', [workshopId, emails[key], `Test ${key}`, hash, r])
    }
    return { workshopId, emails }
  })
}

// Another person in the demo workshop (e.g. a second car owner), so tests never change the demo people's cars.
export async function addPerson(roles: string[], name = 'Test person') {
  return withDatabase(async (c) => {
    const { workshopId, passwordHash } = (await c.query('SELECT "workshopId", "passwordHash" FROM users WHERE email = $1', ['admin@voltwright.test'])).rows[0]
    const email = `${unique(roles[0]!)}@voltwright.test`
    const id = (await c.query('INSERT INTO users ("workshopId", email, name, "passwordHash", roles) VALUES ($1, $2, $3, $4, $5) RETURNING id', [workshopId, email, name, passwordHash, roles])).rows[0].id as number
    return { id, email }
  })
}
