import { platformKeyParamSchema } from '../../../shared/schemas/platform'

export default defineEventHandler(async (event) => {
  const { key } = await getValidatedRouterParams(event, zodValidator(platformKeyParamSchema))
  const user = await requireUser(event)
  const platform = await findWorkshopPlatform(key, user.workshopId)
  if (!platform) throw createError({ statusCode: 404, message: `No drive unit "${key}" in this workshop.` })
  return platformView(platform)
})
