import { snagCreateSchema } from '../../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requireRole(event, ...SNAG_WRITERS)
  const { vehicle } = await requireVehicle(event, id)
  const input = await readValidatedBody(event, zodValidator(snagCreateSchema))
  setResponseStatus(event, 201)
  return createSnag(user, vehicle, input)
})
