// Cars whose controller was last found holding something other than what was signed off.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  return listDriftedCars(user.workshopId)
})
