import { snagListQuerySchema } from '../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(snagListQuerySchema))
  const user = await requirePermission(event, 'staff')
  return listSnags(user, query)
})
