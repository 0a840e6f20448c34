import { snagListQuerySchema } from '../../../shared/schemas/snag'

export default defineEventHandler(async (event) => {
  const query = await getValidatedQuery(event, zodValidator(snagListQuerySchema))
  const user = await requireStaff(event)
  return listSnags(user, query)
})
