// Walks the workshop's whole chain and reports the first broken link, if any.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'auditor', 'admin')
  return verifyChain(user.workshopId)
})
