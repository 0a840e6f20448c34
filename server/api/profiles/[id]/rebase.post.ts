import { rebaseSchema } from '../../../../shared/schemas/kit'

// A new draft on the kit's newer baseline, with the car's own deviations and the tuner's choices.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'versions.write')
  const input = await readValidatedBody(event, zodValidator(rebaseSchema))
  setResponseStatus(event, 201)
  return rebaseProfile(user, id, input)
})
