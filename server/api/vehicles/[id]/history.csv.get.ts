import { historyQuerySchema } from '../../../../shared/schemas/history'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { limit: _limit, ...query } = await getValidatedQuery(event, zodValidator(historyQuerySchema))
  const { user, vehicle } = await requireVehicle(event, id, 'staff')
  return sendHistoryCsv(event, { workshopId: user.workshopId, vehicleId: id }, query, `history-${vehicle.stockRef}.csv`)
})
