export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'tuner')
  return draftWorklist(user)
})
