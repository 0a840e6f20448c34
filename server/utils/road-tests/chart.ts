// The model's prediction for the tested version beside what the road test measured.
import { TelemetryLog } from '../../models'
import type { SignedIn } from '../guards/guards'
import type { ModelComparison, RoadTestChart } from '../../../shared/schemas/road-test-views'
import type { TelemetrySummary } from '../../../shared/telemetry/summary'
import type { TelemetrySeries } from '../../../shared/telemetry/downsample'
import type { RoadTest } from '../../models'
import type { TestedVersion } from './record'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { findTestedVersion, findRoadTest } from './record'

const valueOf = (rt: RoadTest, key: string, name: string): number | null => {
  const v = rt.checks.find(c => c.key === key)?.values?.[name]
  return typeof v === 'number' ? v : null
}

export async function compareWithModel(rt: RoadTest, tested: TestedVersion, summary: TelemetrySummary | null): Promise<ModelComparison> {
  const { vehicle, version } = tested
  const settings = await loadWorkshopSettings(vehicle.workshopId)
  const { figures } = evaluateOnServer(vehicle.spec, vehicle.platform!, version.parameters, settings)
  const measuredDecel = summary?.peakLiftOffDecelMs2 ?? valueOf(rt, 'lift-off-regen', 'decelMs2')
  return {
    liftOffDecel: { predictedMs2: figures.liftOffDecelMs2, measuredMs2: measuredDecel, gripLimitMs2: figures.regenGripLimitMs2[rt.conditions.surface] ?? null, drivenAxle: vehicle.spec.drivenAxle },
    startGrade: { predictedMaxPct: figures.maxStartGradePct, testedPct: valueOf(rt, 'hill-start', 'gradientPct'), limitedBy: figures.startGradeLimitedBy },
    rollback: { measuredM: summary?.maxRollbackM ?? null, reportedMm: valueOf(rt, 'hill-start', 'rollbackMm') },
    topSpeed: { predictedKph: figures.topSpeedKph, measuredKph: summary?.peakSpeedKph ?? valueOf(rt, 'full-power', 'peakSpeedKph') }
  }
}

export async function roadTestChart(user: SignedIn, id: number): Promise<RoadTestChart> {
  const rt = await findRoadTest(user, id)
  const tested = await findTestedVersion(user, rt.versionId)
  const log = await TelemetryLog.findOne({ where: { roadTestId: rt.id }, order: [['id', 'DESC']] })
  const summary = (log?.summary ?? null) as TelemetrySummary | null
  return { series: (log?.series ?? null) as TelemetrySeries | null, comparison: await compareWithModel(rt, tested, summary) }
}
