import { workshopCheckCreateSchema } from '../../../../shared/schemas/workshop-checks'
import { createCheck } from '../../../utils/workshop/checks'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const input = await readValidatedBody(event, zodValidator(workshopCheckCreateSchema))
  setResponseStatus(event, 201)
  return createCheck(admin, input)
})
