import { headMailBodySchema } from '../../../shared/schemas/history'

// Mails the history's newest event (id and hash) now, to the workshop's auditors and whoever asked, so an
// independent copy exists to check the history against later (docs/history.md).
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'history.verify')
  await readValidatedBody(event, zodValidator(headMailBodySchema))
  return mailHeadNow(user)
})
