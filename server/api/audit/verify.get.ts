// Walks the workshop's whole chain and reports the first broken link, if any.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'history.verify')
  return verifyChain(user.workshopId)
})
