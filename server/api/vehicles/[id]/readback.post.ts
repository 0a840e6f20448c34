import { readbackBodySchema } from '../../../../shared/schemas/readback'

// A read-back of the car's controller, compared with its signed-off profile: a difference flags drift.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, vehicle } = await requireVehicle(event, id, 'readbacks.record')
  const body = await readValidatedBody(event, zodValidator(readbackBodySchema))
  setResponseStatus(event, 201)
  return recordReadback(user, vehicle, body)
})
