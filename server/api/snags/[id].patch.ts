import { snagUpdateSchema } from '../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requireRole(event, ...SNAG_WRITERS)
  const input = await readValidatedBody(event, zodValidator(snagUpdateSchema))
  return updateSnag(user, id, input)
})
