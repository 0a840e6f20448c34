import { workshopCheckKeyParamSchema, workshopCheckPatchSchema } from '../../../../shared/schemas/workshop-checks'
import { changeCheck } from '../../../utils/workshop/checks'

// Change a check or retire it; a check is never deleted, so old road tests keep what they were recorded with.
export default defineEventHandler(async (event) => {
  const { key } = await getValidatedRouterParams(event, zodValidator(workshopCheckKeyParamSchema))
  const admin = await requirePermission(event, 'workshop.configure')
  const input = await readValidatedBody(event, zodValidator(workshopCheckPatchSchema))
  return changeCheck(admin, key, input)
})
