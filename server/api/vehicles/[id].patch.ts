import { vehicleUpdateSchema } from '../../../shared/schemas/vehicle'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { vehicle } = await requireVehicle(event, id)
  const user = await requireRole(event, 'admin', 'tuner', 'engineer')
  const input = await readValidatedBody(event, zodValidator(vehicleUpdateSchema))
  return updateVehicle(user, vehicle, input)
})
