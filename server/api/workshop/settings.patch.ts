import { z } from 'zod'

// Some settings; the rest stay as they are. The merged whole is checked with workshopSettingsSchema, which
// names every unknown setting and every value of the wrong kind, text holding U+0000 included.
const bodySchema = z.record(z.string(), z.unknown(), { error: 'The settings must be a JSON object' })

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'workshop.configure')
  const change = await readValidatedBody(event, zodValidator(bodySchema, { nulCheck: false }))
  return updateWorkshopSettings(admin, change)
})
