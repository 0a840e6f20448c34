import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { submitSchema } from '../../../../shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('submit'))
  const input = await readValidatedBody(event, zodValidator(submitSchema))
  return submitVersion(user, id, input)
})
