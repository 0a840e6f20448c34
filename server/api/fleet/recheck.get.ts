// The latest re-check of the workshop's cars: progress, and the cars with new warnings, worst first.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  return latestRecheck(user.workshopId)
})
