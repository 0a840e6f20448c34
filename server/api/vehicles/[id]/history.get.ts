import { historyQuerySchema } from '../../../../shared/schemas/history'

// The car's story, newest first: staff and auditors read it; its owner does not.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const query = await getValidatedQuery(event, zodValidator(historyQuerySchema))
  const user = await requireVehicleAccess(event, id, 'staff')
  requireRecordAccess(user, query.include)
  return readHistory({ workshopId: user.workshopId, vehicleId: id }, query)
})
