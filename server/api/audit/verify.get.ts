import { verifyQuerySchema } from '../../../shared/schemas/history'

// Walks the workshop's whole chain and reports the first broken link, if any; with ?head=id:hash, also
// whether that earlier head is still in the chain unchanged (docs/history.md).
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'history.verify')
  const { head } = await getValidatedQuery(event, zodValidator(verifyQuerySchema))
  return verifyChain(user.workshopId, head)
})
