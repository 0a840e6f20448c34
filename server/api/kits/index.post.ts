import { kitCreateSchema } from '../../../shared/schemas/kit'

// A new kit with its baseline profile and the baseline's first draft.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'cars.write')
  const input = await readValidatedBody(event, zodValidator(kitCreateSchema))
  setResponseStatus(event, 201)
  return createKit(user, input)
})
