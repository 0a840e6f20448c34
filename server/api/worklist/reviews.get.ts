export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'versions.review')
  return reviewWorklist(user)
})
