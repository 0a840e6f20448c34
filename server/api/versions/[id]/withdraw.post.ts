export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requireRole(event, 'tuner')
  return withdrawVersion(user, id)
})
