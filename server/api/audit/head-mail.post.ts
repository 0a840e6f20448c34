import { headMailBodySchema } from '../../../shared/schemas/history'

// Mails the history's newest event (id and hash) now, to the workshop's auditors and whoever asked (or to the
// asker only, with {"to": "me"}), so an
// independent copy exists to check the history against later (docs/history.md). At most three in ten minutes
// per person (429 with Retry-After after that).
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'history.verify')
  const body = await readValidatedBody(event, zodValidator(headMailBodySchema))
  return mailHeadNow(event, user, body?.to ?? 'auditors')
})
