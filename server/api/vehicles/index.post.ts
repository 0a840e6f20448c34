import { vehicleCreateSchema } from '../../../shared/schemas/vehicle'

export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'cars.write')
  const input = await readValidatedBody(event, zodValidator(vehicleCreateSchema))
  setResponseStatus(event, 201)
  return createVehicle(user, input)
})
