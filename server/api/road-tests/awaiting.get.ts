export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'road-tests.record')
  return awaitingRoadTests(user)
})
