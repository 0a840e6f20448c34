import { kitUpdateSchema } from '../../../shared/schemas/kit'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requireRole(event, 'admin', 'tuner', 'engineer')
  const input = await readValidatedBody(event, zodValidator(kitUpdateSchema))
  return updateKit(user, id, input)
})
