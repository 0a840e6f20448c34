import { Op } from 'sequelize'
import { RoadTest, Workshop, type Vehicle } from '../../models'
import { vehicleStatusLabels, type VehicleStatus } from '../../../shared/schemas/vehicle'
import { describeSettings } from '../../../shared/utils/plain-words'
import type { ClientCarView } from '../../../shared/schemas/client-view'
import { snagPriorityLabels, type SnagPriority } from '../../../shared/schemas/snag'
import { openWorkAdvice } from '../../../shared/schemas/handover'
import { onCarProfiles } from '../fleet/readbacks'
import { openSnags } from './open-snags'
import { defaultSettings, evaluate, workshopSettingsSchema } from '../../../shared/compute'

// What a car's owner sees: the car, what its controller is set to in plain words, how the road test went and
// what is still to do, and what the workshop offers next. No people, notes or evaluations; open faults by title.
export async function clientCarView(vehicle: Vehicle): Promise<ClientCarView> {
  const [profiles, workshop] = await Promise.all([onCarProfiles(vehicle.id), Workshop.findByPk(vehicle.workshopId, { attributes: ['settings'] })])
  // Parsed here rather than through utils/evaluation, which brings the server-only schema compiler along.
  const parsed = workshopSettingsSchema.safeParse(workshop?.settings ?? {})
  const settings = parsed.success ? parsed.data : defaultSettings
  const onCar = profiles.map((p) => {
    const figures = vehicle.platform ? evaluate(vehicle.spec, vehicle.platform, p.parameters, settings).figures : {}
    return { profile: p.name, versionNo: p.versionNo, words: describeSettings(vehicle.platform?.schema, p.parameters, figures, vehicle.platform?.torqueConstantNmPerA) }
  })
  const test = profiles.length
    ? await RoadTest.findOne({ where: { vehicleId: vehicle.id, versionId: { [Op.in]: profiles.map(p => p.versionId) } }, order: [['testedAt', 'DESC']] })
    : null
  const { enhancements, work } = await openSnags(vehicle.id)
  return {
    car: { id: vehicle.id, stockRef: vehicle.stockRef, make: vehicle.make, model: vehicle.model, year: vehicle.year, registration: vehicle.registration, status: vehicle.status, statusLabel: vehicleStatusLabels[vehicle.status as VehicleStatus] },
    onCar,
    roadTest: test ? { testedAt: test.testedAt.toISOString(), verdict: test.verdict, surface: test.conditions?.surface ?? '' } : null,
    enhancements: enhancements.map(s => ({ id: s.id, title: s.title, detail: s.detail, status: s.status })),
    openWork: work.map(s => ({ id: s.id, title: s.title, priority: snagPriorityLabels[s.priority as SnagPriority] })),
    openWorkAdvice: openWorkAdvice(work.map(s => s.priority), vehicle.status !== 'handed-over'),
    handoverPdf: `/api/vehicles/${vehicle.id}/handover.pdf`,
    drift: vehicle.driftedAt ? { since: vehicle.driftedAt.toISOString() } : null
  }
}
