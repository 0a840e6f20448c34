import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { approveSchema } from '../../../../shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('approve'))
  const { comment } = await readValidatedBody(event, zodValidator(approveSchema))
  return decideVersion(user, id, 'approve', comment)
})
