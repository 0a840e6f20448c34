export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  return listKits(user)
})
