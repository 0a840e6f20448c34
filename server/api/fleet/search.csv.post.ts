import { searchRequestSchema } from '../../../shared/schemas/fleet-search'

// The same search as a spreadsheet file (up to 5,000 rows).
export default defineEventHandler(async (event) => {
  const user = await requirePermission(event, 'staff')
  const q = await readValidatedBody(event, zodValidator(searchRequestSchema))
  const csv = await searchCsv(user, q)
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', 'attachment; filename="voltwright-fleet-search.csv"')
  return csv
})
