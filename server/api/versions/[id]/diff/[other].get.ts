import { diffParamsSchema } from '../../../../../shared/schemas/profile'

// From version :id (before) to version :other (after): {rows, figures, warnings, patch, evaluations}.
export default defineEventHandler(async (event) => {
  const { id, other } = await getValidatedRouterParams(event, zodValidator(diffParamsSchema))
  const user = await requirePermission(event, 'staff')
  return diffVersions(user, id, other)
})
