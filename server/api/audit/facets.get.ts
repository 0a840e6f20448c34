import { facetsQuerySchema } from '../../../shared/schemas/history'

// The actions and people a car's (or the workshop's) history holds, for the filter menus.
export default defineEventHandler(async (event) => {
  const { vehicleId } = await getValidatedQuery(event, zodValidator(facetsQuerySchema))
  if (vehicleId) {
    const user = await requireVehicleAccess(event, vehicleId, 'staff')
    return historyFacets({ workshopId: user.workshopId, vehicleId })
  }
  const user = await requirePermission(event, 'activity.read')
  return historyFacets({ workshopId: user.workshopId })
})
