// A fleet for the benchmark: `DATABASE_URL=… tsx scripts/seed-fleet.ts [--cars 10000]`. A workshop of its own
// ("Harrow Fleet Conversions", people @harrow.voltwright.test, demo password) whose cars each have one profile of
// five versions, the fifth signed off and on the car with its evaluation kept, as sign-off leaves them.
// Specs and settings vary over a few hundred combinations, each evaluated once by the product's own code.
import pg from 'pg'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { defaultParameters, findPlatform } from '../shared/platforms'
import { exampleSpec } from '../shared/compute/example'
import { defaultSettings, evaluate } from '../shared/compute'
import { PARAMETER_NAMES } from '../shared/compute/parameters'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { snapshotOf, versionContentHash } from '../server/utils/versions/content'

const arg = (name: string, fallback: number) => { const i = process.argv.indexOf(`--${name}`); return i > 0 ? Number(process.argv[i + 1]) : fallback }
const CARS = arg('cars', 10_000)
const BATCH = 500
const WORKSHOP = 'Harrow Fleet Conversions'
const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')
const db = new pg.Client({ connectionString: url })
await db.connect()
const q = async <T = Record<string, unknown>>(sql: string, params: unknown[] = []) => (await db.query(sql, params)).rows as T[]

const platform = findPlatform('fenlow-45')!
const axles = ['rear', 'front', 'rear', 'all'] as const
// Variant i: mass, axle and regen vary so that searches find some cars and not others.
function variant(i: number) {
  const spec = vehicleSpecSchema.parse({ ...exampleSpec, kerbMassKg: 800 + (i % 13) * 50, drivenAxle: axles[i % 4], frontAxleLoadPct: 45 + (i % 7) * 2 })
  const parameters = { ...defaultParameters(platform), regenTorqueLimitNm: 60 + (i % 5) * 15, liftOffRegenPct: 10 + (i % 9) * 8, powerCapKw: 35 + (i % 4) * 3 } as Record<string, number>
  const evaluation = evaluate(spec, platform, parameters, defaultSettings)
  return { spec, parameters, evaluation }
}
const VARIANTS = 260
const variants = Array.from({ length: VARIANTS }, (_, i) => variant(i))
// The earlier versions differ only by the power cap; each is evaluated once per variant and number.
const cache: Record<string, ReturnType<typeof evaluate>> = {}
function evaluateCached(v: ReturnType<typeof variant>, no: number) {
  const key = `${variants.indexOf(v)}:${no}`
  cache[key] ??= evaluate(v.spec, platform, { ...v.parameters, powerCapKw: v.parameters.powerCapKw! - (5 - no) }, defaultSettings)
  return cache[key]!
}

let [w] = await q<{ id: number }>('SELECT id FROM workshops WHERE name = $1', [WORKSHOP])
if (!w) [w] = await q<{ id: number }>(`INSERT INTO workshops (name, settings) VALUES ($1, '{}') RETURNING id`, [WORKSHOP])
const hash = await new Hash(new Scrypt({})).make('voltwright-demo')
for (const role of ['engineer', 'tuner']) {
  await q(`INSERT INTO users ("workshopId", email, name, "passwordHash", roles) VALUES ($1, $2, $3, $4, $5) ON CONFLICT (email) DO NOTHING`, [w!.id, `${role}@harrow.voltwright.test`, `Harrow ${role}`, hash, [role]])
}
const [author] = await q<{ id: number }>(`SELECT id FROM users WHERE email = 'tuner@harrow.voltwright.test'`)
const [pl] = await q<{ id: number }>(`SELECT id FROM platforms WHERE key = 'fenlow-45' AND "workshopId" IS NULL`)
const have = Number((await q<{ n: string }>('SELECT count(*) AS n FROM vehicles WHERE "workshopId" = $1', [w!.id]))[0]!.n)
const started = Date.now()

for (let from = have; from < CARS; from += BATCH) {
  const n = Math.min(BATCH, CARS - from)
  await q('BEGIN')
  const cars = await q<{ id: number }>(`INSERT INTO vehicles ("workshopId", "stockRef", make, model, year, spec, "platformId", status)
    SELECT $1, 'HF-' || lpad(g::text, 5, '0'), 'Harrowby', 'Fleet Saloon', 1960 + g % 15, (CAST($2 AS jsonb))->(g % $3), $4, 'handed-over'
      FROM generate_series($5::int, $6::int) g ORDER BY g RETURNING id`, [w!.id, JSON.stringify(variants.map(v => v.spec)), VARIANTS, pl!.id, from + 1, from + n])
  const profiles = await q<{ id: number }>(`INSERT INTO profiles ("workshopId", "vehicleId", name) SELECT $1, unnest($2::int[]), 'Road' RETURNING id`, [w!.id, cars.map(c => c.id)])
  for (let no = 1; no <= 5; no++) {
    const rows = profiles.map((p, k) => {
      const v = variants[(from + k + 1) % VARIANTS]!
      const parameters = no === 5 ? v.parameters : { ...v.parameters, powerCapKw: v.parameters.powerCapKw! - (5 - no) }
      const content = { profileId: p.id, versionNo: no, parentVersionId: null, parameters, rationale: `Bench version ${no}`, authorId: author!.id, origin: 'workshop' as const }
      return { ...content, state: no === 5 ? 'signed-off' : 'superseded', evaluation: snapshotOf(no === 5 ? v.evaluation : evaluateCached(v, no)), contentHash: versionContentHash(content) }
    })
    await q(`INSERT INTO profile_versions ("workshopId", "profileId", "versionNo", parameters, rationale, "authorId", state, evaluation, "contentHash", "submittedAt", "decidedAt")
      SELECT $1, r."profileId", r."versionNo", r.parameters, r.rationale, r."authorId", r.state, r.evaluation, r."contentHash", now(), now()
        FROM jsonb_to_recordset(CAST($2 AS jsonb)) AS r("profileId" int, "versionNo" int, parameters jsonb, rationale text, "authorId" int, state text, evaluation jsonb, "contentHash" text)`, [w!.id, JSON.stringify(rows)])
  }
  await q(`UPDATE profiles p SET "onCarVersionId" = pv.id FROM profile_versions pv WHERE pv."profileId" = p.id AND pv."versionNo" = 5 AND p.id = ANY($1::int[])`, [profiles.map(p => p.id)])
  await q(`INSERT INTO on_car_evaluations ("profileId", "workshopId", "vehicleId", "versionId", settings, "liftOffDecelMs2", "brakeRegenDecelMs2", "gripDryMs2", "gripWetMs2", "gripSnowMs2",
      "zeroTo50S", "zeroTo100S", "topSpeedKph", "maxStartGradePct", "creepHoldGradePct", "powerRatioToOriginal", "peakDischargeCurrentA", warnings, "dangerCount", "cautionCount")
    SELECT p.id, $1, p."vehicleId", pv.id, pv.parameters, (f->>'liftOffDecelMs2')::float8, (f->>'brakeRegenDecelMs2')::float8, (f->'regenGripLimitMs2'->>'dry')::float8, (f->'regenGripLimitMs2'->>'wet')::float8,
      (f->'regenGripLimitMs2'->>'snow')::float8, (f->>'zeroTo50S')::float8, (f->>'zeroTo100S')::float8, (f->>'topSpeedKph')::float8, (f->>'maxStartGradePct')::float8, (f->>'creepHoldGradePct')::float8,
      (f->>'powerRatioToOriginal')::float8, (f->>'peakDischargeCurrentA')::float8,
      ARRAY(SELECT DISTINCT w->>'rule' FROM jsonb_array_elements(pv.evaluation->'warnings') w),
      (SELECT count(*) FROM jsonb_array_elements(pv.evaluation->'warnings') w WHERE w->>'severity' = 'danger'),
      (SELECT count(*) FROM jsonb_array_elements(pv.evaluation->'warnings') w WHERE w->>'severity' = 'caution')
      FROM profiles p JOIN profile_versions pv ON pv.id = p."onCarVersionId", LATERAL (SELECT pv.evaluation->'figures' AS f) x WHERE p.id = ANY($2::int[])`, [w!.id, profiles.map(p => p.id)])
  // The role values the sign-off writes beside the figures (server/utils/fleet/on-car-evaluation.ts).
  const roles = profiles.map((p, k) => ({ profileId: p.id, ...variants[(from + k + 1) % VARIANTS]!.evaluation.roles }))
  await q(`UPDATE on_car_evaluations e SET ${PARAMETER_NAMES.map(n => `"${n}" = r."${n}"`).join(', ')}
      FROM jsonb_to_recordset(CAST($1 AS jsonb)) AS r("profileId" int, ${PARAMETER_NAMES.map(n => `"${n}" float8`).join(', ')}) WHERE e."profileId" = r."profileId"`, [JSON.stringify(roles)])
  await q('COMMIT')
  console.log(`[seed-fleet] ${from + n} of ${CARS} cars (${((Date.now() - started) / 1000).toFixed(0)} s)`)
}
await q('ANALYZE vehicles; ANALYZE on_car_evaluations; ANALYZE profile_versions')
await db.end()

