import { platformUploadSchema } from '../../../shared/schemas/platform'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const input = await readValidatedBody(event, zodValidator(platformUploadSchema))
  setResponseStatus(event, 201)
  return createPlatform(admin, input)
})
