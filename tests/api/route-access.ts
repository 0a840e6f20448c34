// Who may call each route, read from the handlers' guards (server/api) and the permissions map (docs/architecture.md#roles). The guards test fails
// when a route file has no entry here, so every new route is given a rule on purpose.
import type { Role } from '../../shared/schemas/roles'
import sharp from 'sharp'
import { signIn, withDatabase } from './helpers'
import { addSnag, newCar } from './fixtures'
import { multipart, upload } from './road-test-fixtures'

// Demo things looked up at the start of the test; each `[param]` of a route names the one it is called with.
// signedOff: a signed-off version by tuner@ (so withdrawing it is refused for its state); sibling: another version of its profile;
// roadTest: a signed road test (so sign-off and uploads are refused for its state).
export type Fixture = 'car' | 'profile' | 'signedOff' | 'sibling' | 'roadTest' | 'snag' | 'user' | 'platform' | 'attachment' | 'check' | 'kit'

export interface Access {
  roles: readonly Role[]
  anonymous?: boolean
  // What a manager of another workshop gets: 404 where the id is looked up in their workshop first,
  // 403 where the role check comes first, 'allowed' where the route has no id of workshop A's.
  foreign: 404 | 403 | 'allowed'
  params?: Record<string, Fixture>
  // The route looks the car up as its owner sees it: a client on another owner's car gets 404.
  ownerScoped?: boolean
  // The body the foreign manager sends when a deliberately broken one would be refused (400) before the lookup.
  foreignBody?: unknown
}

const all = ['admin', 'tuner', 'engineer', 'tester', 'auditor', 'client'] as const
const staff = ['admin', 'tuner', 'engineer', 'tester', 'auditor'] as const
const snagWriters = ['admin', 'tuner', 'engineer', 'tester'] as const
const car = { id: 'car' } as const
const version = { id: 'signedOff' } as const
const roadTest = { id: 'roadTest' } as const
const snag = { id: 'snag' } as const

export const routeAccess: Record<string, Access> = {
  'attachments/[id].get.ts': { roles: staff, foreign: 404, params: { id: 'attachment' } },
  'audit/events.csv.get.ts': { roles: ['auditor', 'admin', 'engineer'], foreign: 'allowed' },
  'audit/events.get.ts': { roles: ['auditor', 'admin', 'engineer'], foreign: 'allowed' },
  'audit/facets.get.ts': { roles: ['auditor', 'admin', 'engineer'], foreign: 'allowed' },
  'audit/verify.get.ts': { roles: ['auditor', 'admin'], foreign: 'allowed' },
  'audit/head-mail.post.ts': { roles: ['auditor', 'admin'], foreign: 'allowed' },
  'auth/login.post.ts': { roles: all, anonymous: true, foreign: 'allowed' },
  'auth/logout.post.ts': { roles: all, anonymous: true, foreign: 'allowed' },
  'auth/me.get.ts': { roles: all, foreign: 'allowed' },
  'drift/index.get.ts': { roles: staff, foreign: 'allowed' },
  'evaluate.post.ts': { roles: all, foreign: 'allowed' },
  'fleet/recheck.get.ts': { roles: staff, foreign: 'allowed' },
  'fleet/recheck.post.ts': { roles: ['admin', 'engineer'], foreign: 'allowed' },
  'fleet/search.csv.post.ts': { roles: staff, foreign: 'allowed' },
  'fleet/search.post.ts': { roles: staff, foreign: 'allowed' },
  'health.get.ts': { roles: all, anonymous: true, foreign: 'allowed' },
  'kits/[id].get.ts': { roles: staff, foreign: 404, params: { id: 'kit' } },
  'kits/[id].patch.ts': { roles: ['admin', 'tuner', 'engineer'], foreign: 404, params: { id: 'kit' }, foreignBody: {} },
  'kits/index.get.ts': { roles: staff, foreign: 'allowed' },
  'kits/index.post.ts': { roles: ['admin', 'tuner', 'engineer'], foreign: 'allowed' },
  'platforms/[key].get.ts': { roles: all, foreign: 'allowed', params: { key: 'platform' } },
  'platforms/index.get.ts': { roles: all, foreign: 'allowed' },
  'platforms/index.post.ts': { roles: ['admin'], foreign: 'allowed' },
  'profiles/[id]/rebase.get.ts': { roles: staff, foreign: 404, params: { id: 'profile' } },
  'profiles/[id]/rebase.post.ts': { roles: ['tuner'], foreign: 403, params: { id: 'profile' } },
  'profiles/[id]/versions.post.ts': { roles: ['tuner'], foreign: 403, params: { id: 'profile' } },
  'road-tests/[id].get.ts': { roles: staff, foreign: 404, params: roadTest },
  'road-tests/[id]/chart.get.ts': { roles: staff, foreign: 404, params: roadTest },
  'road-tests/[id]/photos.post.ts': { roles: ['tester'], foreign: 403, params: roadTest },
  'road-tests/[id]/roadside-version.post.ts': { roles: ['tester'], foreign: 403, params: roadTest },
  'road-tests/[id]/sign-off.post.ts': { roles: ['tester'], foreign: 403, params: roadTest },
  'road-tests/[id]/telemetry.post.ts': { roles: ['tester'], foreign: 403, params: roadTest },
  'road-tests/awaiting.get.ts': { roles: ['tester'], foreign: 403 },
  'snags/[id].get.ts': { roles: staff, foreign: 404, params: snag },
  'snags/[id].patch.ts': { roles: snagWriters, foreign: 404, params: snag, foreignBody: {} },
  'snags/[id]/photos.post.ts': { roles: snagWriters, foreign: 404, params: snag },
  'snags/assignees.get.ts': { roles: staff, foreign: 'allowed' },
  'snags/index.get.ts': { roles: staff, foreign: 'allowed' },
  'users/[id].patch.ts': { roles: ['admin'], foreign: 404, params: { id: 'user' }, foreignBody: {} },
  'users/index.get.ts': { roles: ['admin'], foreign: 'allowed' },
  'users/index.post.ts': { roles: ['admin'], foreign: 'allowed' },
  'vehicles/[id].get.ts': { roles: all, foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id].patch.ts': { roles: ['admin', 'tuner', 'engineer'], foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/client-view.get.ts': { roles: all, foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/handover.get.ts': { roles: all, foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/handover.pdf.get.ts': { roles: all, foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/history.csv.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/history.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/profiles.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/profiles.post.ts': { roles: ['tuner'], foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/readback.post.ts': { roles: ['tuner', 'tester'], foreign: 404, params: car, ownerScoped: true },
  'vehicles/[id]/readbacks.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/road-tests.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/snags.get.ts': { roles: staff, foreign: 404, params: car },
  'vehicles/[id]/snags.post.ts': { roles: snagWriters, foreign: 404, params: car },
  'vehicles/index.get.ts': { roles: all, foreign: 'allowed' },
  'vehicles/index.post.ts': { roles: ['admin', 'tuner', 'engineer'], foreign: 'allowed' },
  'versions/[id].get.ts': { roles: staff, foreign: 404, params: version },
  'versions/[id].patch.ts': { roles: ['tuner'], foreign: 403, params: version },
  'versions/[id]/approve.post.ts': { roles: ['engineer'], foreign: 403, params: version },
  'versions/[id]/diff/[other].get.ts': { roles: staff, foreign: 404, params: { id: 'signedOff', other: 'sibling' } },
  'versions/[id]/reject.post.ts': { roles: ['engineer'], foreign: 403, params: version },
  'versions/[id]/road-test-brief.get.ts': { roles: staff, foreign: 404, params: version },
  'versions/[id]/road-tests.post.ts': { roles: ['tester'], foreign: 403, params: version },
  'versions/[id]/submit.post.ts': { roles: ['tuner'], foreign: 403, params: version },
  'versions/[id]/withdraw.post.ts': { roles: ['tuner'], foreign: 403, params: version },
  'worklist/drafts.get.ts': { roles: ['tuner'], foreign: 403 },
  'worklist/reviews.get.ts': { roles: ['engineer'], foreign: 403 },
  'workshop/index.get.ts': { roles: all, foreign: 'allowed' },
  'workshop/checks/index.get.ts': { roles: staff, foreign: 'allowed' },
  'workshop/checks/index.post.ts': { roles: ['admin'], foreign: 'allowed' },
  'workshop/checks/[key].patch.ts': { roles: ['admin'], foreign: 404, params: { key: 'check' }, foreignBody: {} },
  'workshop/settings.patch.ts': { roles: ['admin'], foreign: 'allowed' }
}

// The demo workshop's things, so the only reason for a refusal is who asks (seeders/*).
export async function demoFixtures(): Promise<Record<Fixture, string> & { otherCar: string }> {
  return withDatabase(async (c) => {
    const one = async (sql: string, args: unknown[] = []) => {
      const row = (await c.query(sql, args)).rows[0]
      if (!row) throw new Error(`no demo row for: ${sql}`)
      return String(row.id)
    }
    const ids = (await c.query(`SELECT id, "workshopId" FROM users WHERE email IN ('client@voltwright.test', 'tuner@voltwright.test') ORDER BY email`)).rows
    const [client, tuner] = ids as { id: number, workshopId: number }[]
    const ws = client!.workshopId
    const signedOff = await one(`SELECT id FROM profile_versions v WHERE "workshopId" = $1 AND state = 'signed-off' AND "authorId" = $2
      AND EXISTS (SELECT 1 FROM profile_versions o WHERE o."profileId" = v."profileId" AND o.id <> v.id) ORDER BY id LIMIT 1`, [ws, tuner!.id])
    return {
      car: await one('SELECT id FROM vehicles WHERE "ownerUserId" = $1 ORDER BY id LIMIT 1', [client!.id]),
      otherCar: await one('SELECT id FROM vehicles WHERE "workshopId" = $1 AND "ownerUserId" IS DISTINCT FROM $2 ORDER BY id LIMIT 1', [ws, client!.id]),
      profile: await one('SELECT id FROM profiles WHERE "workshopId" = $1 ORDER BY id LIMIT 1', [ws]),
      signedOff,
      sibling: await one(`SELECT id FROM profile_versions WHERE "profileId" = (SELECT "profileId" FROM profile_versions WHERE id = $1) AND id <> $1 ORDER BY id LIMIT 1`, [signedOff]),
      roadTest: await one('SELECT id FROM road_tests WHERE "workshopId" = $1 AND signed IS NOT NULL ORDER BY id LIMIT 1', [ws]),
      snag: await one('SELECT id FROM snags WHERE "workshopId" = $1 ORDER BY id LIMIT 1', [ws]),
      user: String(tuner!.id),
      platform: 'fenlow-45',
      check: 'heater-demister',
      kit: await one('SELECT id FROM kits WHERE "workshopId" = $1 ORDER BY id LIMIT 1', [ws]),
      attachment: await photoOfThrowawaySnag()
    }
  })
}

// The demo data holds no stored file, so one photo goes on a snag of a car made for the purpose.
async function photoOfThrowawaySnag(): Promise<string> {
  const tuner = await signIn('tuner@voltwright.test')
  const snagId = await addSnag((await newCar(tuner)).id, 'remedial', 'Door seal perished')
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: 'white' } }).png().toBuffer()
  const res = await upload(tuner, `/api/snags/${snagId}/photos`, multipart(png, 'seal.png', 'image/png'))
  if (res.status !== 201) throw new Error(`photo: ${res.status} ${JSON.stringify(res.body)}`)
  return String(res.body.id)
}

