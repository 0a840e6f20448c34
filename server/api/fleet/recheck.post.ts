import { z } from 'zod'

// Re-check every car now (the workshop's thresholds and a new rules release start one by themselves).
const bodySchema = z.object({ note: z.string().trim().max(200, 'At most 200 characters').optional() }).strict()

export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'fleet.recheck')
  const { note } = await readValidatedBody(event, zodValidator(bodySchema))
  const run = await useDatabase().transaction(t => startRecheck(t, user.workshopId, 'asked', note ? { note } : {}, user.id))
  setResponseStatus(event, 202)
  return { id: run.id, total: run.total }
})
