import { roadTestCreateSchema } from '../../../../shared/schemas/road-test'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'road-tests.record')
  const input = await readValidatedBody(event, zodValidator(roadTestCreateSchema))
  setResponseStatus(event, 201)
  return recordRoadTest(user, id, input)
})
