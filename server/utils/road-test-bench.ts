// The tester's bench: approved versions awaiting a road test, oldest approval first.
import { fn, col } from 'sequelize'
import { Profile, ProfileVersion, RoadTest, Vehicle } from '../models'
import type { SignedIn } from './guards'
import type { AwaitingRoadTest } from '../../shared/schemas/road-test-views'

export async function awaitingRoadTests(user: SignedIn): Promise<{ items: AwaitingRoadTest[], total: number }> {
  const versions = await ProfileVersion.findAll({
    where: { workshopId: user.workshopId, state: 'approved' },
    include: [{ model: Profile, as: 'profile', include: [{ model: Vehicle, as: 'vehicle' }] }],
    order: [['decidedAt', 'ASC'], ['id', 'ASC']]
  })
  const counts = versions.length
    ? await RoadTest.findAll({ where: { versionId: versions.map(v => v.id) }, attributes: ['versionId', [fn('count', col('id')), 'n']], group: ['versionId'], raw: true }) as unknown as { versionId: number, n: string }[]
    : []
  const items = versions.map((v) => {
    const car = (v.profile as Profile & { vehicle?: Vehicle }).vehicle!
    return {
      versionId: v.id, versionNo: v.versionNo, profileId: v.profileId, profileName: v.profile!.name, approvedAt: v.decidedAt ? new Date(v.decidedAt).toISOString() : null,
      vehicle: { id: car.id, stockRef: car.stockRef, make: car.make, model: car.model, year: car.year },
      roadTests: Number(counts.find(c => c.versionId === v.id)?.n ?? 0)
    }
  })
  return { items, total: items.length }
}
