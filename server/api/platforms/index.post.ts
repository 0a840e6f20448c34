import { platformUploadSchema } from '../../../shared/schemas/platform'

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'platforms.upload')
  const input = await readValidatedBody(event, zodValidator(platformUploadSchema))
  setResponseStatus(event, 201)
  return createPlatform(admin, input)
})
