import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { roadTestCreateSchema } from '../../../../shared/schemas/road-test'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('road-test'))
  const input = await readValidatedBody(event, zodValidator(roadTestCreateSchema))
  setResponseStatus(event, 201)
  return recordRoadTest(user, id, input)
})
