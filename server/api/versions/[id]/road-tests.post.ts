import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { roadTestCreateSchema } from '../../../../shared/schemas/road-test'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('road-test'))
  const input = await readValidatedBody(event, zodValidator(roadTestCreateSchema))
  const { repeated, ...recorded } = await recordRoadTest(user, id, input)
  setResponseStatus(event, repeated ? 200 : 201)
  return recorded
})
