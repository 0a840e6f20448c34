// Conversion kits: listing, reading, creating (with the baseline's first draft) and editing (docs/kits.md).
import { QueryTypes } from 'sequelize'
import { Kit, Platform, Profile, ProfileVersion, Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import { defaultParameters } from '../../../shared/platforms'
import type { KitCreate, KitSummary, KitUpdate, KitView } from '../../../shared/schemas/kit'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { findWorkshopPlatform } from '../platforms/platforms'
import { insertProfile } from '../versions/create'
import { insertVersion } from '../versions/insert'
import { withRecordedPeople } from '../history/recorded-names'
import { authorInclude, reviewsInclude, versionSummary } from '../versions/views'
import { profileBaselines } from './baseline'

interface KitRow { id: number, name: string, fits: KitSummary['fits'], baselineProfileId: number | null, platformKey: string, platformName: string, latestId: number | null, latestNo: number | null, carCount: string }

const summary = (r: KitRow): KitSummary => ({
  id: r.id, name: r.name, fits: r.fits, baselineProfileId: r.baselineProfileId, platform: { key: r.platformKey, name: r.platformName },
  latestApproved: r.latestId ? { id: r.latestId, versionNo: r.latestNo! } : null, carCount: Number(r.carCount)
})

// The workshop's kits with their drive unit, newest approved baseline and how many cars were built from each.
export async function listKits(user: SignedIn, kitId?: number): Promise<{ items: KitSummary[], total: number }> {
  const rows = await useDatabase().query<KitRow>(
    `SELECT k.id, k.name, k.fits, k."baselineProfileId", pl.key AS "platformKey", pl.name AS "platformName", la.id AS "latestId", la."versionNo" AS "latestNo",
            (SELECT count(*) FROM vehicles v WHERE v."kitId" = k.id) AS "carCount"
       FROM kits k JOIN platforms pl ON pl.id = k."platformId"
       LEFT JOIN LATERAL (SELECT pv.id, pv."versionNo" FROM profile_versions pv WHERE pv."profileId" = k."baselineProfileId" AND pv.state = 'approved' ORDER BY pv."versionNo" DESC LIMIT 1) la ON true
      WHERE k."workshopId" = :workshopId ${kitId ? 'AND k.id = :kitId' : ''} ORDER BY k.name`,
    { replacements: { workshopId: user.workshopId, kitId: kitId ?? null }, type: QueryTypes.SELECT })
  return { items: rows.map(summary), total: rows.length }
}

export async function findKit(user: SignedIn, id: number) {
  const kit = await Kit.findOne({ where: { id, workshopId: user.workshopId }, include: [{ model: Platform, as: 'platform' }] })
  if (!kit) throw createError({ statusCode: 404, message: 'No such kit in this workshop.' })
  return kit
}

// A kit with its spec template, its baseline's versions newest first, and the cars built from it.
export async function readKit(user: SignedIn, id: number): Promise<KitView> {
  const kit = await findKit(user, id)
  const [head] = (await listKits(user, kit.id)).items
  const versions = await ProfileVersion.findAll({ where: { profileId: kit.baselineProfileId ?? 0 }, include: [authorInclude, reviewsInclude], order: [['versionNo', 'DESC']] })
  const cars = await Vehicle.findAll({ where: { kitId: kit.id, workshopId: user.workshopId }, order: [['stockRef', 'ASC']] })
  const profiles = await Profile.findAll({ where: { vehicleId: cars.map(c => c.id) }, include: [{ model: ProfileVersion, as: 'versions', attributes: ['id', 'versionNo', 'state', 'parameters', 'baselineVersionId'] }] })
  const baselines = await profileBaselines(profiles)
  const moved = (carId: number) => profiles.some(p => p.vehicleId === carId && baselines.get(p.id)?.moved)
  return {
    ...head!, specTemplate: kit.specTemplate, versions: await withRecordedPeople(user.workshopId, versions.map(versionSummary)),
    cars: cars.map(c => ({ id: c.id, stockRef: c.stockRef, make: c.make, model: c.model, year: c.year, status: c.status, onLatest: !moved(c.id) }))
  }
}

function sameName(e: unknown): never {
  if ((e as { name?: string }).name === 'SequelizeUniqueConstraintError') {
    throw createError({ statusCode: 409, message: 'Another kit already has this name.', data: { fields: [{ path: 'name', message: 'Already used' }] } })
  }
  throw e
}

export async function createKit(user: SignedIn, input: KitCreate): Promise<KitView> {
  const platform = await findWorkshopPlatform(input.platformKey, user.workshopId)
  if (!platform) throw createError({ statusCode: 400, message: `Unknown drive unit "${input.platformKey}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  const id = await useDatabase().transaction(async (t) => {
    const kit = await Kit.create({ workshopId: user.workshopId, name: input.name, platformId: platform.id, fits: input.fits, specTemplate: input.specTemplate }, { transaction: t })
    await appendAuditEvent(t, { workshopId: user.workshopId, actorId: user.id, action: 'kit.created', entityType: 'kit', entityId: kit.id, data: { after: { name: kit.name, platformKey: platform.key, fits: kit.fits, specTemplate: kit.specTemplate } } })
    const profile = await insertProfile(t, user, { kitId: kit.id }, 'Baseline')
    await kit.update({ baselineProfileId: profile.id }, { transaction: t })
    const parameters = { ...defaultParameters(platform), ...input.parameters }
    await insertVersion(t, user, { profile, vehicleId: null, parameters, rationale: input.rationale, parent: null, origin: 'workshop' })
    return kit.id
  }).catch(sameName)
  return readKit(user, id)
}

// Name, fits and template change; the cars already built keep the spec they were booked in with.
export async function updateKit(user: SignedIn, id: number, input: KitUpdate): Promise<KitView> {
  await useDatabase().transaction(async (t) => {
    const kit = await Kit.findOne({ where: { id, workshopId: user.workshopId }, transaction: t, lock: t.LOCK.UPDATE })
    if (!kit) throw createError({ statusCode: 404, message: 'No such kit in this workshop.' })
    const before = { name: kit.name, fits: kit.fits, specTemplate: kit.specTemplate }
    const after = { ...before, ...input }
    const patch = jsonPatch(before, after)
    if (!patch.length) return
    await kit.update(input, { transaction: t })
    await appendAuditEvent(t, { workshopId: user.workshopId, actorId: user.id, action: 'kit.updated', entityType: 'kit', entityId: kit.id, data: { patch } })
  }).catch(sameName)
  return readKit(user, id)
}
