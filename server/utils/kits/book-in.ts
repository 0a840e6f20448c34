// Booking a car in from a kit: the kit's drive unit, its spec template with the car's own facts laid over,
// and a first draft started from the baseline's newest approved version (docs/kits.md).
import { Vehicle } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { VehicleFromKit } from '../../../shared/schemas/vehicle'
import { vehicleSpecSchema } from '../../../shared/schemas/vehicle-spec'
import { zodFieldErrors } from '../guards/validate'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { assertOwner, duplicateRef, vehicleInclude, vehicleView } from '../fleet/vehicles'
import { insertProfile } from '../versions/create'
import { insertVersion } from '../versions/insert'
import { findKit } from './kits'
import { latestApprovedBaseline } from './baseline'

function mergedSpec(template: object, given: Record<string, unknown>) {
  const result = vehicleSpecSchema.safeParse({ ...template, ...given })
  if (result.success) return result.data
  const fields = zodFieldErrors(result.error).map(f => ({ ...f, path: `spec.${f.path}` }))
  throw createError({ statusCode: 400, message: `Please check: ${fields.map(f => `${f.path} (${f.message})`).join('; ')}`.slice(0, 500), data: { fields } })
}

export async function bookInFromKit(user: SignedIn, input: VehicleFromKit) {
  const { kitId, profileName, spec: given, ...fields } = input
  const kit = await findKit(user, kitId)
  const spec = mergedSpec(kit.specTemplate, given)
  await assertOwner(fields.ownerUserId, user.workshopId)
  const id = await useDatabase().transaction(async (t) => {
    const baseline = kit.baselineProfileId ? await latestApprovedBaseline(kit.baselineProfileId, t) : null
    if (!baseline) throw createError({ statusCode: 409, message: `The ${kit.name} kit has no approved baseline yet; an engineer must approve one before cars are booked in from it.` })
    const v = await Vehicle.create({ ...fields, spec, workshopId: user.workshopId, platformId: kit.platformId, kitId: kit.id }, { transaction: t }).catch(duplicateRef)
    await appendAuditEvent(t, {
      workshopId: user.workshopId, vehicleId: v.id, actorId: user.id, action: 'vehicle.created', entityType: 'vehicle', entityId: v.id,
      data: { after: { ...fields, spec, platformKey: kit.platform!.key }, kitId: kit.id, kitName: kit.name, baselineVersionId: baseline.id, baselineVersionNo: baseline.versionNo }
    })
    const profile = await insertProfile(t, user, { vehicleId: v.id }, profileName)
    await insertVersion(t, user, {
      profile, vehicleId: v.id, parameters: baseline.parameters, rationale: `Started from the ${kit.name} kit's baseline, version ${baseline.versionNo}.`,
      parent: null, origin: 'workshop', baselineVersionId: baseline.id
    })
    return v.id
  })
  return vehicleView((await Vehicle.findByPk(id, { include: vehicleInclude }))!)
}
