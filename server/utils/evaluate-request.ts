import type { H3Event } from 'h3'
import type { Evaluation } from '../../shared/compute'
import type { EvaluateRequest } from '../../shared/schemas/evaluate'

// POST /api/evaluate: a stored car (scoped like requireVehicle) or a typed spec, on a drive unit of this workshop.
export async function evaluateRequest(event: H3Event, input: EvaluateRequest): Promise<Evaluation> {
  const user = await requireUser(event)
  const vehicle = input.vehicleId !== undefined ? (await requireVehicle(event, input.vehicleId)).vehicle : null
  const spec = vehicle ? vehicle.spec : input.spec!
  // The car's own drive unit came with the car; another one is looked up.
  const platform = vehicle?.platform?.key === input.platformKey ? vehicle.platform : await findWorkshopPlatform(input.platformKey, user.workshopId)
  if (!platform) {
    throw createError({ statusCode: 400, message: `Unknown drive unit "${input.platformKey}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  }
  const settings = await loadWorkshopSettings(user.workshopId)
  return evaluateOnServer(spec, platform, input.parameters, settings)
}
