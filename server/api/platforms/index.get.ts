import { Op } from 'sequelize'
import { Platform } from '../../models'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const rows = await Platform.findAll({ where: { [Op.or]: [{ workshopId: null }, { workshopId: user.workshopId }] }, order: [['motorMaxRpm', 'ASC'], ['key', 'ASC']] })
  return { items: rows.map(platformView), total: rows.length }
})
