export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, vehicle } = await requireVehicle(event, id, 'staff')
  return listProfiles(user, vehicle)
})
