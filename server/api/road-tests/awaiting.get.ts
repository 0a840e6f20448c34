export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'tester')
  return awaitingRoadTests(user)
})
