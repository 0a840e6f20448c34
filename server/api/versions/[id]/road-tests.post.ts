import { roadTestCreateSchema } from '../../../../shared/schemas/road-test'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'road-tests.record')
  const input = await readValidatedBody(event, zodValidator(roadTestCreateSchema))
  const { repeated, ...recorded } = await recordRoadTest(user, id, input)
  setResponseStatus(event, repeated ? 200 : 201)
  return recorded
})
