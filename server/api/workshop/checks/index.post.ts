import { workshopCheckCreateSchema } from '../../../../shared/schemas/workshop-checks'
import { createCheck } from '../../../utils/workshop/checks'

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'workshop.configure')
  const input = await readValidatedBody(event, zodValidator(workshopCheckCreateSchema))
  setResponseStatus(event, 201)
  return createCheck(admin, input)
})
