import { snagListQuerySchema } from '../../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const query = await getValidatedQuery(event, zodValidator(snagListQuerySchema))
  const { user, vehicle } = await requireVehicle(event, id, 'staff')
  return listSnags(user, query, vehicle.id)
})
