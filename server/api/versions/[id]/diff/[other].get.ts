import { diffParamsSchema } from '../../../../../shared/schemas/profile'

// From version :id (before) to version :other (after): {rows, figures, warnings, patch, evaluations}.
export default defineEventHandler(async (event) => {
  const { id, other } = await getValidatedRouterParams(event, zodValidator(diffParamsSchema))
  return diffVersions(event, id, other)
})
