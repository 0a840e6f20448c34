import { Op } from 'sequelize'
import { Platform } from '../../models'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const rows = await Platform.findAll({ where: { [Op.or]: [{ workshopId: null }, { workshopId: user.workshopId }] }, order: [['motorMaxRpm', 'ASC'], ['key', 'ASC']] })
  return { items: rows.map(p => ({ id: p.id, key: p.key, name: p.name, motorMaxRpm: p.motorMaxRpm, schema: p.schema })), total: rows.length }
})
