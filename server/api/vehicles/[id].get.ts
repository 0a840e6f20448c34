export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { vehicle } = await requireVehicle(event, id)
  await vehicle.reload({ include: ['platform', 'owner'] })
  return vehicleView(vehicle)
})
