// The tester's bench: approved versions awaiting a road test, oldest approval first.
import { fn, col } from 'sequelize'
import { checksFor } from '../workshop/checks'
import { Profile, ProfileVersion, RoadTest, Snag, Vehicle } from '../../models'
import { unresolvedSnagStatuses } from '../../../shared/schemas/snag'
import type { SignedIn } from '../guards/guards'
import type { AwaitingRoadTest } from '../../../shared/schemas/road-test-views'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { findTestedVersion } from './record'

export async function awaitingRoadTests(user: SignedIn): Promise<{ items: AwaitingRoadTest[], total: number }> {
  const versions = await ProfileVersion.findAll({
    where: { workshopId: user.workshopId, state: 'approved' },
    include: [{ model: Profile, as: 'profile', required: true, include: [{ model: Vehicle, as: 'vehicle', required: true }] }],
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

export async function roadTestBrief(user: SignedIn, versionId: number) {
  const { version, profile, vehicle } = await findTestedVersion(user, versionId)
  const { figures, warnings, roles } = evaluateOnServer(vehicle.spec, vehicle.platform!, version.parameters, await loadWorkshopSettings(user.workshopId))
  // Before setting off: the way back (the profile's signed-off version, if other than this), an earlier failed
  // road test of this version, and the blocking snags a sign-off would wait for.
  const [onCar, failedEarlier, blocking] = await Promise.all([
    profile.onCarVersionId && profile.onCarVersionId !== version.id ? ProfileVersion.findByPk(profile.onCarVersionId, { attributes: ['versionNo'] }) : null,
    RoadTest.findOne({ where: { versionId: version.id, workshopId: user.workshopId, verdict: 'fail' }, attributes: ['id', 'testedAt'], order: [['testedAt', 'DESC'], ['id', 'DESC']] }),
    Snag.findAll({ where: { vehicleId: vehicle.id, workshopId: user.workshopId, blocking: true, status: unresolvedSnagStatuses }, attributes: ['id', 'title'], order: [['id', 'ASC']] })
  ])
  return {
    version: { id: version.id, versionNo: version.versionNo, state: version.state, authorId: version.authorId, parameters: version.parameters },
    profile: { id: profile.id, name: profile.name, onCarVersionNo: onCar?.versionNo ?? null },
    vehicle: { id: vehicle.id, stockRef: vehicle.stockRef, make: vehicle.make, model: vehicle.model, year: vehicle.year, platformKey: vehicle.platform?.key ?? null, spec: vehicle.spec },
    // The drive unit as the browser's evaluation needs it, so a roadside change shows its warnings as it is typed.
    platform: { key: vehicle.platform!.key, name: vehicle.platform!.name, motorMaxRpm: vehicle.platform!.motorMaxRpm, schema: vehicle.platform!.schema },
    platformSchema: vehicle.platform?.schema ?? null,
    expected: {
      maxStartGradePct: figures.maxStartGradePct, creepHoldGradePct: figures.creepHoldGradePct, liftOffDecelMs2: figures.liftOffDecelMs2,
      brakeRegenDecelMs2: figures.brakeRegenDecelMs2, topSpeedKph: figures.topSpeedKph, zeroTo50S: figures.zeroTo50S, regenGripLimitMs2: figures.regenGripLimitMs2,
      // Derate starts in °C whatever unit the drive unit gives them in; null where it has none.
      derateStartC: { motor: roles?.motorDerateStartC ?? null, inverter: roles?.inverterDerateStartC ?? null, battery: roles?.batteryDerateStartC ?? null }
    },
    warnings: warnings.map(w => ({ rule: w.rule, severity: w.severity, message: w.message })),
    extraChecks: await checksFor(user.workshopId, vehicle.platform?.key ?? null),
    failedEarlier: failedEarlier ? { id: failedEarlier.id, testedAt: new Date(failedEarlier.testedAt).toISOString() } : null,
    blockingSnags: blocking.map(b => ({ id: b.id, title: b.title }))
  }
}
