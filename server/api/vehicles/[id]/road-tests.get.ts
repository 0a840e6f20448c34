export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  await requireStaff(event)
  const { vehicle } = await requireVehicle(event, id)
  return listVehicleRoadTests(vehicle)
})
