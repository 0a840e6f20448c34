import { activityQuerySchema } from '../../../shared/schemas/history'

// The workshop's activity feed: every event, newest first, with the history's filters and an optional car.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'activity.read')
  const { vehicleId, ...query } = await getValidatedQuery(event, zodValidator(activityQuerySchema))
  requireRecordAccess(user, query.include)
  return readHistory({ workshopId: user.workshopId, vehicleId }, query)
})
