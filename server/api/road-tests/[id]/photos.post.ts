import { z } from 'zod'

const querySchema = z.object({ caption: z.string().trim().max(200).default('') })

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { caption } = await getValidatedQuery(event, zodValidator(querySchema))
  const user = await requirePermission(event, 'road-tests.record')
  const rt = await findRoadTest(user, id)
  if (rt.signed) throw createError({ statusCode: 409, message: 'This road test is signed off; its record can no longer change.' })
  const photo = await uploadPhoto(event, user, { ownerType: 'road-test', ownerId: rt.id, vehicleId: rt.vehicleId, caption }).catch(uploadError)
  setResponseStatus(event, 201)
  return photo
})
