// `npm run telemetry:demo`: writes a synthetic controller log (CSV) for each demo car, from the car's own
// figures at its drive unit's default settings, for uploading on a road test. Invented data, for the demo.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { evaluate } from '../shared/compute'
import { defaultParameters, platforms } from '../shared/platforms'
import { vehicleSpecSchema } from '../shared/schemas/vehicle-spec'
import { syntheticDrive, telemetryCsv } from '../shared/telemetry/synthetic'
import { demoCars } from '../seeders/demo-cars'

const out = resolve(process.argv[2] ?? join('.data', 'demo-telemetry'))
mkdirSync(out, { recursive: true })
for (const [i, car] of demoCars.entries()) {
  const platform = platforms[car.platformIndex]!
  const spec = vehicleSpecSchema.parse(car.spec)
  const parameters = defaultParameters(platform)
  const { figures, roles } = evaluate(spec, platform, parameters)
  const role = (name: 'powerCapKw' | 'torqueCapNm' | 'creepSpeedKph') => roles?.[name] ?? 0 // in the role's own unit
  const samples = syntheticDrive({
    massKg: figures.testMassKg ?? spec.kerbMassKg + 150, rollingRadiusM: figures.rollingRadiusM ?? 0.29, finalDriveRatio: spec.finalDriveRatio,
    powerCapKw: role('powerCapKw'), torqueCapNm: role('torqueCapNm'), liftOffDecelMs2: figures.liftOffDecelMs2 ?? 0.8,
    brakeRegenDecelMs2: figures.brakeRegenDecelMs2 ?? 1.5, packVoltageV: spec.packNominalVoltageV, creepSpeedKph: role('creepSpeedKph')
  }, { laps: 3, hz: 10, ambientC: 12 + i, rollbackM: 0.04 + 0.02 * i, startGradePct: 12 + 2 * i })
  const file = join(out, `${car.stockRef}-road-test.csv`)
  writeFileSync(file, telemetryCsv(samples))
  console.log(`${file}: ${samples.length} samples, ${(samples.at(-1)!.timeS / 60).toFixed(1)} min`)
}
