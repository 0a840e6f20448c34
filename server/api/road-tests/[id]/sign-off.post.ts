import { routePermission } from '../../../../shared/schemas/version-lifecycle'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, routePermission('sign-off'))
  return signOffRoadTest(user, id)
})
