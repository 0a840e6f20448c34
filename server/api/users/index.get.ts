import { User } from '../../models'

export default defineEventHandler(async (event) => {
  const admin = await requirePermission(event, 'people.manage')
  const { rows, count } = await User.findAndCountAll({ where: { workshopId: admin.workshopId }, order: [['name', 'ASC']] })
  return { items: rows.map(u => u.toPublic()), total: count }
})
