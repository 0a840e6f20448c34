// The car as its owner sees it (staff may look too, to see what the owner sees).
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { vehicle } = await requireVehicle(event, id)
  return clientCarView(vehicle)
})
