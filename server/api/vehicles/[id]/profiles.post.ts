import { profileCreateSchema } from '../../../../shared/schemas/profile'

// A new named profile for the car ("Road", "Valet"), starting with version 1 as a draft.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, vehicle } = await requireVehicle(event, id, 'versions.write')
  const input = await readValidatedBody(event, zodValidator(profileCreateSchema))
  setResponseStatus(event, 201)
  return createProfile(user, vehicle, input)
})
