export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { vehicle } = await requireVehicle(event, id, 'staff')
  return listVehicleRoadTests(vehicle)
})
