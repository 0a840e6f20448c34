import { userUpdateSchema } from '../../../shared/schemas/user'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const admin = await requireRole(event, 'admin')
  const input = await readValidatedBody(event, zodValidator(userUpdateSchema))
  return updatePerson(admin, id, input)
})
