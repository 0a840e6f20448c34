export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'road-tests.record')
  const stored = await uploadTelemetry(event, user, id).catch(uploadError)
  setResponseStatus(event, 201)
  return stored
})
