import { vehicleCreateSchema } from '../../../shared/schemas/vehicle'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'tuner', 'engineer')
  const input = await readValidatedBody(event, zodValidator(vehicleCreateSchema))
  setResponseStatus(event, 201)
  return createVehicle(user, input)
})
