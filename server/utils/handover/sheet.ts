import type { RecordedCheck } from '../../../shared/schemas/workshop-checks'
// Gathers the handover sheet: the car, each profile's on-car version with its figures, warnings and
// justifications, the road test that signed it off, the people and hashes, open enhancements, cautions.
import { Profile, ProfileVersion, Review, RoadTest, TelemetryLog, User, Workshop, type Vehicle } from '../../models'
import { driftNotice, handoverCautions, openWorkAdvice, type HandoverProfile, type HandoverSheet } from '../../../shared/schemas/handover'
import { checkVerdictLabels, surfaceLabels, type CheckKey, type CheckVerdict } from '../../../shared/schemas/road-test'
import { checkTitles } from '../../../shared/schemas/road-test-checks'
import { measuredValues } from '../../../shared/utils/check-measures'
import { formatDate } from '../../../shared/utils/dates'
import { snagKindLabels, snagPriorityLabels, type SnagKind, type SnagPriority } from '../../../shared/schemas/snag'
import { vehicleStatusLabels, type VehicleStatus } from '../../../shared/schemas/vehicle'
import type { TelemetrySummary } from '../../../shared/telemetry/summary'
import { carFactLines, figureLines, settingLines } from './words'
import { openSnags } from './open-snags'
import { loadWorkshopSettings, evaluateOnServer } from '../platforms/evaluation'
import { recordedVersionActors } from '../history/recorded-names'
import { localeNumber } from '../../../shared/utils/number-format'
import { figureNumber } from '../../../shared/utils/figure-digits'

// A mandatory check by its title; one of the workshop's own by the label and unit it was recorded with.
function checkLine(c: RoadTest['checks'][number], list: RecordedCheck[]) {
  const def = list.find(d => d.key === c.key)
  const value = def && typeof c.values?.value === 'number' ? `${localeNumber(c.values.value, { maximumFractionDigits: 2 })}${def.unit ? ` ${def.unit}` : ''}` : '—'
  return {
    label: def?.label ?? checkTitles[c.key as CheckKey] ?? c.key, verdict: checkVerdictLabels[c.verdict as CheckVerdict] ?? c.verdict,
    measured: def ? value : measuredValues(c.key, c.values).join(', ') || '—', note: c.note
  }
}

function logLines(s: TelemetrySummary | undefined) {
  if (!s) return []
  const f = (x: number | null, d = 1) => x === null ? '—' : localeNumber(x, { maximumFractionDigits: d })
  return [
    { label: 'Logged', value: `${localeNumber(s.samples)} samples over ${f(s.durationS / 60, 1)} min` },
    { label: 'Peak speed', value: `${f(s.peakSpeedKph, 0)} km/h` },
    { label: 'Peak battery power', value: `${f(s.peakPowerKw, 1)} kW` },
    { label: 'Strongest lift-off slowing', value: `${figureNumber(s.peakLiftOffDecelMs2, 'm/s²')} m/s²` },
    { label: 'Roll-back on the hill start', value: `${f(s.maxRollbackM * 1000, 0)} mm` },
    { label: 'Peak temperatures', value: `motor ${f(s.peakMotorC, 0)} °C, inverter ${f(s.peakInverterC, 0)} °C, battery ${f(s.peakBatteryC, 0)} °C` },
    { label: 'Energy', value: `${f(s.energyOutWh / 1000, 2)} kWh used, ${f(s.energyRegenWh / 1000, 2)} kWh recovered by regen` }
  ]
}

async function profileSheet(vehicle: Vehicle, profile: Profile, version: ProfileVersion): Promise<HandoverProfile> {
  const [author, review, rt, recorded] = await Promise.all([
    User.findByPk(version.authorId, { attributes: ['name'] }),
    Review.findOne({ where: { versionId: version.id, decision: 'approve' }, order: [['id', 'DESC']], include: [{ model: User, as: 'reviewer', attributes: ['name'] }] }),
    RoadTest.findOne({ where: { versionId: version.id, verdict: 'pass' }, order: [['id', 'DESC']], include: [{ model: User, as: 'tester', attributes: ['name'] }] }).then(async r => r?.signed ? r : null),
    recordedVersionActors(vehicle.workshopId, version.id)
  ])
  const log = rt ? await TelemetryLog.findOne({ where: { roadTestId: rt.id }, order: [['id', 'DESC']] }) : null
  const evaluation = evaluateOnServer(vehicle.spec, vehicle.platform!, version.parameters, await loadWorkshopSettings(vehicle.workshopId))
  // Names as the history recorded them when each acted; the person's name today only where it recorded none.
  const tester = rt ? recorded['version.signed-off'] ?? (rt as RoadTest & { tester?: User }).tester?.name ?? '' : ''
  const approver = review ? recorded['version.approved'] ?? (review as Review & { reviewer?: User }).reviewer?.name : undefined
  return {
    profileName: profile.name, versionNo: version.versionNo, versionId: version.id, signedOffAt: rt?.signed?.at ?? null,
    settings: settingLines(vehicle.platform!.schema, version.parameters), figures: figureLines(evaluation, vehicle.spec),
    warnings: evaluation.warnings.map(w => ({ rule: w.rule, severity: w.severity, message: w.message, justification: version.justifications?.[w.rule] ?? null })),
    roadTest: rt ? {
      id: rt.id, testedAt: new Date(rt.testedAt).toISOString(), tester, verdict: rt.verdict,
      conditions: `${surfaceLabels[rt.conditions.surface]} road, ${rt.conditions.ambientC} °C${rt.conditions.route ? `, ${rt.conditions.route}` : ''}`,
      checks: rt.checks.map(c => checkLine(c, rt.checkList ?? [])),
      log: logLines(log?.summary as TelemetrySummary | undefined)
    } : null,
    people: [
      { role: 'Proposed by', name: recorded['version.created'] ?? author?.name ?? '—', at: (version.submittedAt ?? version.createdAt)?.toISOString() ?? null, hash: version.contentHash, hashLabel: 'settings hash' },
      { role: 'Approved by', name: approver ?? '—', at: review ? new Date(review.createdAt).toISOString() : (version.decidedAt?.toISOString() ?? null), hash: version.contentHash, hashLabel: 'settings hash' },
      { role: 'Road-tested and signed off by', name: tester || '—', at: rt?.signed?.at ?? null, hash: rt?.signed?.contentHash ?? null, hashLabel: 'road-test record hash' }
    ]
  }
}

export async function handoverSheet(vehicle: Vehicle): Promise<HandoverSheet> {
  await vehicle.reload({ include: ['platform', 'owner'] })
  const profiles = await Profile.findAll({ where: { vehicleId: vehicle.id }, order: [['id', 'ASC']] })
  const onCar = profiles.filter(p => p.onCarVersionId)
  if (!onCar.length) throw createError({ statusCode: 409, message: 'No profile has been signed off for this car yet: the handover sheet follows sign-off.' })
  const versions = await ProfileVersion.findAll({ where: { id: onCar.map(p => p.onCarVersionId!) } })
  // Faults and repairs, most pressing first: the owner is told what is still to do and whether to drive.
  const [workshop, { enhancements, work }] = await Promise.all([
    Workshop.findByPk(vehicle.workshopId, { attributes: ['name'] }),
    openSnags(vehicle.id)
  ])
  const owner = (vehicle as Vehicle & { owner?: User | null }).owner
  return {
    workshop: workshop?.name ?? '', generatedAt: new Date().toISOString(),
    car: { id: vehicle.id, title: `${vehicle.year} ${vehicle.make} ${vehicle.model}`, stockRef: vehicle.stockRef, registration: vehicle.registration, chassisNumber: vehicle.chassisNumber, owner: owner?.name ?? null, driveUnit: vehicle.platform?.name ?? '', status: vehicleStatusLabels[vehicle.status as VehicleStatus] },
    carFacts: carFactLines(vehicle.spec, vehicle.platform?.name ?? ''),
    profiles: await Promise.all(onCar.map(p => profileSheet(vehicle, p, versions.find(v => v.id === p.onCarVersionId)!))),
    enhancements: enhancements.map(s => ({ title: s.title, detail: s.detail, priority: snagPriorityLabels[s.priority as SnagPriority] })),
    openWork: work.map(s => ({ title: s.title, kind: snagKindLabels[s.kind as SnagKind], priority: snagPriorityLabels[s.priority as SnagPriority] })),
    openWorkAdvice: openWorkAdvice(work.map(s => s.priority)),
    cautions: handoverCautions(vehicle.spec.drivenAxle),
    notice: vehicle.driftedAt ? driftNotice(formatDate(vehicle.driftedAt, { timeZone: 'UTC' })) : null
  }
}
