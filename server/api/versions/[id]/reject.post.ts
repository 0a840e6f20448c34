import { routePermission } from '../../../../shared/schemas/version-lifecycle'
import { rejectSchema } from '../../../../shared/schemas/profile'

// Sending a version back needs a comment: the tuner has to know what to change.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('reject'))
  const { comment } = await readValidatedBody(event, zodValidator(rejectSchema))
  return decideVersion(user, id, 'reject', comment)
})
