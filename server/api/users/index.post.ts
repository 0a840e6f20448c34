import { userCreateSchema } from '../../../shared/schemas/user'

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'people.manage')
  const input = await readValidatedBody(event, zodValidator(userCreateSchema))
  setResponseStatus(event, 201)
  return createPerson(admin, input)
})
