export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'versions.write')
  return draftWorklist(user)
})
