import { listChecks } from '../../../utils/workshop/checks'

// The workshop's own road-test checks, retired ones too (a tester's wizard reads the brief instead).
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  const items = await listChecks(user.workshopId)
  return { items, total: items.length }
})
