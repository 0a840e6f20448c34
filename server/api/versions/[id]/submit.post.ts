import { submitSchema } from '../../../../shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'versions.write')
  const input = await readValidatedBody(event, zodValidator(submitSchema))
  return submitVersion(user, id, input)
})
