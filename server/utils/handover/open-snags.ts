// A car's snags still to be dealt with, as the handover sheet and the owner's view tell them: the enhancements
// on offer in the order raised, and the faults and repairs most pressing first.
import { Op } from 'sequelize'
import { Snag } from '../../models'
import { mostPressingFirst, unresolvedSnagStatuses } from '../../../shared/schemas/snag'

export async function openSnags(vehicleId: number): Promise<{ enhancements: Snag[], work: Snag[] }> {
  const open = await Snag.findAll({ where: { vehicleId, status: { [Op.in]: unresolvedSnagStatuses } }, order: [['id', 'ASC']] })
  return { enhancements: open.filter(s => s.kind === 'enhancement'), work: mostPressingFirst(open.filter(s => s.kind !== 'enhancement')) }
}
