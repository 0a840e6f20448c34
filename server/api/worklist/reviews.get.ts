export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'engineer')
  return reviewWorklist(user)
})
