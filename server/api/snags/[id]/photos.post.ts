import { z } from 'zod'

const querySchema = z.object({ caption: z.string().trim().max(200).default('') })

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { caption } = await getValidatedQuery(event, zodValidator(querySchema))
  const user = await requirePermission(event, 'snags.write')
  const snag = await findSnag(user, id)
  const photo = await uploadPhoto(event, user, { ownerType: 'snag', ownerId: snag.id, vehicleId: snag.vehicleId, caption }).catch(uploadError)
  setResponseStatus(event, 201)
  return photo
})
