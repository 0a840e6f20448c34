import { vehicleUpdateSchema } from '../../../shared/schemas/vehicle'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, vehicle } = await requireVehicle(event, id, 'cars.write')
  const input = await readValidatedBody(event, zodValidator(vehicleUpdateSchema))
  return updateVehicle(user, vehicle, input)
})
