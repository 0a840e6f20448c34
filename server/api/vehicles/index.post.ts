import { vehicleCreateSchema, vehicleFromKitSchema } from '../../../shared/schemas/vehicle'

// Booking a car in: from the facts given, or from a kit (with `kitId`), which also starts its first draft.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'tuner', 'engineer')
  const body = await readBody(event)
  setResponseStatus(event, 201)
  if (body && typeof body === 'object' && 'kitId' in body) return bookInFromKit(user, parseOr400(vehicleFromKitSchema, body))
  return createVehicle(user, parseOr400(vehicleCreateSchema, body))
})
