import { userCreateSchema } from '../../../shared/schemas/user'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const input = await readValidatedBody(event, zodValidator(userCreateSchema))
  setResponseStatus(event, 201)
  return createPerson(admin, input)
})
