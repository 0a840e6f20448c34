import { z } from 'zod'

// Some settings; the rest stay as they are. The merged whole is checked with workshopSettingsSchema.
const bodySchema = z.record(z.string(), z.unknown(), { error: 'The settings must be a JSON object' })

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'workshop.configure')
  const change = await readValidatedBody(event, zodValidator(bodySchema))
  return updateWorkshopSettings(admin, change)
})
