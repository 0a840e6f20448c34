// The signed-in person's workshop with its rule thresholds and unit preferences (defaults filled in).
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return workshopView(user)
})
