import { snagCreateSchema } from '../../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, vehicle } = await requireVehicle(event, id, 'snags.write')
  const input = await readValidatedBody(event, zodValidator(snagCreateSchema))
  setResponseStatus(event, 201)
  return createSnag(user, vehicle, input)
})
