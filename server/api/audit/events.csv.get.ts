import { activityQuerySchema } from '../../../shared/schemas/history'

export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'activity.read')
  const { vehicleId, limit: _limit, ...query } = await getValidatedQuery(event, zodValidator(activityQuerySchema))
  return sendHistoryCsv(event, { workshopId: user.workshopId, vehicleId }, query, `activity-${new Date().toISOString().slice(0, 10)}.csv`)
})
