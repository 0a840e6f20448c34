import { routePermission } from '../../../shared/schemas/version-lifecycle'
import { versionUpdateSchema } from '../../../shared/schemas/profile'

// The author saves a draft; `lockVersion` is the one they loaded, so a stale save is refused, not applied.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('edit'))
  const input = await readValidatedBody(event, zodValidator(versionUpdateSchema))
  return updateDraft(user, id, input)
})
