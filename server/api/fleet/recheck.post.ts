import { z } from 'zod'

// Re-check every car now (the workshop's thresholds, drive units and rules changes start one by themselves).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'engineer')
  await readValidatedBody(event, zodValidator(z.object({}).strict()))
  const run = await useDatabase().transaction(t => startRecheck(t, user.workshopId, 'asked', {}, user.id))
  setResponseStatus(event, 202)
  return { id: run.id, total: run.total }
})
