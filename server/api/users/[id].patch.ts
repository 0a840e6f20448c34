import { userUpdateSchema } from '../../../shared/schemas/user'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const admin = await requirePermission(event, 'people.manage')
  const input = await readValidatedBody(event, zodValidator(userUpdateSchema))
  return updatePerson(admin, id, input)
})
