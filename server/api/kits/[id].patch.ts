import { kitUpdateSchema } from '../../../shared/schemas/kit'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'cars.write')
  const input = await readValidatedBody(event, zodValidator(kitUpdateSchema))
  return updateKit(user, id, input)
})
