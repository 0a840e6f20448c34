import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { roadsideVersionSchema } from '../../../../shared/schemas/road-test'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('roadside-change'))
  const input = await readValidatedBody(event, zodValidator(roadsideVersionSchema))
  setResponseStatus(event, 201)
  return recordRoadsideVersion(user, id, input)
})
