export default defineEventHandler(async (event) => {
  const user = await requireStaff(event)
  return listKits(user)
})
