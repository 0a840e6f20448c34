import { vehicleListQuerySchema } from '../../../shared/schemas/vehicle'

export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(vehicleListQuerySchema))
  return listVehicles(event, query)
})
