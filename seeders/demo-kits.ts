// The demo workshop's two bolt-in kits and the cars built from them; all of it invented for the demo.
import type { VehicleSpecInput } from '../shared/schemas/vehicle-spec'
import type { KitFit } from '../shared/schemas/kit'
import type { DemoVersion } from './demo-profiles'
import type { DemoCar } from './demo-cars'

export interface DemoKitCar { car: Omit<DemoCar, 'platformIndex' | 'ownedByClient' | 'spec'>, spec: Partial<VehicleSpecInput>, onBaselineNo: number, versions: DemoVersion[] }
export interface DemoKit { name: string, platformKey: string, fits: KitFit[], specTemplate: VehicleSpecInput, baseline: DemoVersion[], cars: DemoKitCar[] }

const tuner = 'tuner@voltwright.test'
const engineer = 'engineer@voltwright.test'
const lead = 'lead@voltwright.test'
const pack = { packNominalVoltageV: 355, packCapacityKwh: 24, packMaxChargeCurrentA: 110, packMaxDischargeCurrentA: 320, chargerPowerKw: 7.4 }
const roadster = { powerCapKw: 42, torqueCapNm: 150, regenTorqueLimitNm: 80, liftOffRegenPct: 25, speedLimitKph: 120 }

export const demoKits: DemoKit[] = [
  {
    name: 'Forge RD-45 small rear-drive', platformKey: 'fenlow-45',
    fits: [{ make: 'Penhallow', model: 'Marten Roadster', yearFrom: 1958, yearTo: 1968 }, { make: 'Penhallow', model: 'Kestrel Roadster', yearFrom: 1961, yearTo: 1969 }, { make: 'Harrowby', model: 'Tamsin 1300 Saloon', yearFrom: 1963, yearTo: 1971 }],
    specTemplate: { kerbMassKg: 930, frontAxleLoadPct: 49, wheelbaseMm: 2300, cgHeightMm: 480, tyreSize: '155/80 R13 79T', finalDriveRatio: 7.2, drivetrainEfficiency: 0.9, dragCoefficient: 0.45, frontalAreaM2: 1.6, rollingResistanceCoeff: 0.011, drivenAxle: 'rear', originalEnginePowerKw: 45, ...pack },
    baseline: [
      { author: tuner, daysAgo: 40, state: 'approved', parameters: roadster, rationale: 'The settings proved on the first four builds: lift-off regen well inside the rear grip in the wet, 120 km/h for drum brakes.', review: { by: engineer, decision: 'approve', comment: 'A sound starting point for this family of cars.' } },
      { author: tuner, daysAgo: 5, state: 'approved', parameters: { ...roadster, liftOffRegenPct: 20, creepTorqueNm: 20 }, rationale: 'Less lift-off regen after a winter owner reported the tail stepping out on a frosty bend; gentler creep for the clutchless gearbox.', review: { by: engineer, decision: 'approve', comment: 'Agreed: snow grip matters on these light tails.' } }
    ],
    cars: [
      {
        car: { stockRef: 'OF-107', make: 'Penhallow', model: 'Kestrel Roadster', year: 1964, chassisNumber: 'PM64-05120', registration: 'HWP 208B', intakeDaysAgo: 25, status: 'road-testing', staged: { daysAgo: 19, time: '11:00' } },
        spec: { kerbMassKg: 915, cgHeightMm: 465 }, onBaselineNo: 1,
        versions: [{ author: tuner, daysAgo: 20, state: 'approved', parameters: { ...roadster, powerCapKw: 40, speedLimitKph: 110 }, rationale: 'From the kit baseline; 40 kW and 110 km/h for this car\'s original cross-ply-era wheels.', review: { by: lead, decision: 'approve', comment: 'Fine for the road test.' } }]
      },
      {
        car: { stockRef: 'OF-108', make: 'Harrowby', model: 'Tamsin 1300 Saloon', year: 1969, chassisNumber: 'HT69-31877', registration: 'FLK 640G', intakeDaysAgo: 3, status: 'converting' },
        spec: { kerbMassKg: 1005, frontAxleLoadPct: 54, wheelbaseMm: 2440, cgHeightMm: 520, tyreSize: '165/80 R13 83T', originalEnginePowerKw: 43 }, onBaselineNo: 2,
        versions: [{ author: tuner, daysAgo: 3, state: 'draft', parameters: { ...roadster, liftOffRegenPct: 20, creepTorqueNm: 20, torqueCapNm: 140 }, rationale: 'From the kit baseline; a little less torque for the saloon\'s older half-shafts.' }]
      }
    ]
  },
  {
    name: 'Forge ES-110 estate', platformKey: 'marrick-110',
    fits: [{ make: 'Velling', model: 'Arden Estate', yearFrom: 1967, yearTo: 1978 }],
    specTemplate: { kerbMassKg: 1340, frontAxleLoadPct: 52, wheelbaseMm: 2640, cgHeightMm: 560, tyreSize: '175/80 R14 88T', finalDriveRatio: 8.1, drivetrainEfficiency: 0.9, dragCoefficient: 0.44, frontalAreaM2: 2.0, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 66, ...pack, packCapacityKwh: 42, packMaxDischargeCurrentA: 400 },
    baseline: [
      { author: lead, daysAgo: 30, state: 'approved', parameters: { powerCapKw: 70, torqueCapNm: 220, regenTorqueLimitNm: 90, liftOffRegenPct: 20, speedLimitKph: 130 }, rationale: 'Estate baseline: 70 kW keeps the power ratio near the original engine\'s; lift-off regen kept modest for a rear-driven car with a load in the back.', review: { by: engineer, decision: 'approve', comment: 'Approved as the estate baseline.' } }
    ],
    cars: [
      {
        car: { stockRef: 'OF-109', make: 'Velling', model: 'Arden Estate', year: 1973, chassisNumber: 'VA73-24406', registration: 'NRT 771L', intakeDaysAgo: 10, status: 'intake' },
        spec: { kerbMassKg: 1365, payloadKg: 250 }, onBaselineNo: 1,
        versions: [{ author: tuner, daysAgo: 2, state: 'draft', parameters: { powerCapKw: 70, torqueCapNm: 220, regenTorqueLimitNm: 90, liftOffRegenPct: 15, speedLimitKph: 130 }, rationale: 'From the kit baseline; less lift-off regen as the owner tows a small trailer.' }]
      }
    ]
  }
]
