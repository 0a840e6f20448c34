// What the tester needs at the roadside: which car and version, and what the model expects of each check.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'staff')
  return roadTestBrief(user, id)
})
