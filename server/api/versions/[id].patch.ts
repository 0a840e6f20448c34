import { versionUpdateSchema } from '../../../shared/schemas/profile'

// The author saves a draft; `lockVersion` is the one they loaded, so a stale save is refused, not applied.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'versions.write')
  const input = await readValidatedBody(event, zodValidator(versionUpdateSchema))
  return updateDraft(user, id, input)
})
