import { vehicleCreateSchema, vehicleFromKitSchema } from '../../../shared/schemas/vehicle'

// Booking a car in: from the facts given, or from a kit (with `kitId`), which also starts its first draft.
const fromKit = zodValidator(vehicleFromKitSchema)
const fromFacts = zodValidator(vehicleCreateSchema)
const bookingBody = (raw: unknown) => (raw && typeof raw === 'object' && 'kitId' in raw ? { kit: fromKit(raw) } : { car: fromFacts(raw) })

export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'cars.write')
  const body = await readValidatedBody(event, bookingBody)
  setResponseStatus(event, 201)
  return 'kit' in body ? bookInFromKit(user, body.kit!) : createVehicle(user, body.car!)
})
