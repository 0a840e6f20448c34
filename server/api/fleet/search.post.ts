import { searchRequestSchema } from '../../../shared/schemas/fleet-search'

// The workshop's cars by facts, on-car settings, what those settings do, and the warnings they raise.
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  const q = await readValidatedBody(event, zodValidator(searchRequestSchema))
  return searchFleet(user, q)
})
