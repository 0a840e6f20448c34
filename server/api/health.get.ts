// Liveness and database reachability, for the start script and load balancers.
export default defineEventHandler(async () => {
  try {
    await useDatabase().query('SELECT 1')
    return { ok: true }
  } catch {
    throw createError({ statusCode: 503, message: 'The database is not reachable.' })
  }
})
