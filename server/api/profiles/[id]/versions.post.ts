import { versionCreateSchema } from '../../../../shared/schemas/profile'

// A new draft from any earlier version of the profile.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'versions.write')
  const input = await readValidatedBody(event, zodValidator(versionCreateSchema))
  setResponseStatus(event, 201)
  return createVersion(user, id, input)
})
