import { Workshop } from '../../models'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const workshop = await Workshop.findByPk(user.workshopId, { attributes: ['id', 'name'] })
  return { ...user, workshop: { id: workshop!.id, name: workshop!.name } }
})
