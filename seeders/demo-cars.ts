import type { VehicleSpecInput } from '../shared/schemas/vehicle-spec'

// Fictional makes and models of the demo workshop; the figures are invented for the demo only.
export interface DemoCar {
  stockRef: string, make: string, model: string, year: number, chassisNumber: string, registration: string
  status: 'intake' | 'converting' | 'road-testing' | 'snagging' | 'handed-over'
  platformIndex: number, ownedByClient: boolean, spec: VehicleSpecInput
  intakeDaysAgo: number // when the car came in, in days before the seed run (seeders/demo-story.ts)
  staged?: { daysAgo: number, time: string } // when it reached its present stage, if not the morning after intake
}

const pack = { packNominalVoltageV: 355, packCapacityKwh: 32, packMaxChargeCurrentA: 110, packMaxDischargeCurrentA: 320, chargerPowerKw: 7.4 }

export const demoCars: DemoCar[] = [
  {
    stockRef: 'OF-101', make: 'Penhallow', model: 'Marten Roadster', year: 1962, chassisNumber: 'PM62-04417', registration: 'KJX 442A', intakeDaysAgo: 30,
    status: 'road-testing', staged: { daysAgo: 5, time: '11:00' }, platformIndex: 0, ownedByClient: true,
    spec: { kerbMassKg: 905, frontAxleLoadPct: 47, wheelbaseMm: 2235, cgHeightMm: 470, tyreSize: '155/80 R13 79T', finalDriveRatio: 7.2, drivetrainEfficiency: 0.9, dragCoefficient: 0.46, frontalAreaM2: 1.55, rollingResistanceCoeff: 0.011, drivenAxle: 'rear', originalEnginePowerKw: 46, ...pack, packCapacityKwh: 24 }
  },
  {
    stockRef: 'OF-102', make: 'Velling', model: 'Arden Estate', year: 1971, chassisNumber: 'VA71-22810', registration: 'UFR 318J', intakeDaysAgo: 14,
    status: 'converting', platformIndex: 1, ownedByClient: false,
    spec: { kerbMassKg: 1340, frontAxleLoadPct: 52, wheelbaseMm: 2640, cgHeightMm: 560, tyreSize: '175/80 R14 88T', finalDriveRatio: 8.1, drivetrainEfficiency: 0.9, dragCoefficient: 0.44, frontalAreaM2: 2.0, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 66, ...pack, packCapacityKwh: 42, packMaxDischargeCurrentA: 400 }
  },
  {
    stockRef: 'OF-103', make: 'Tregarth', model: 'Minim 850', year: 1965, chassisNumber: 'TM65-90031', registration: 'DLP 71C', intakeDaysAgo: 75,
    status: 'handed-over', staged: { daysAgo: 57, time: '16:00' }, platformIndex: 0, ownedByClient: true,
    spec: { kerbMassKg: 760, frontAxleLoadPct: 61, wheelbaseMm: 2035, cgHeightMm: 450, tyreSize: '145/80 R12 74S', finalDriveRatio: 6.8, drivetrainEfficiency: 0.91, dragCoefficient: 0.42, frontalAreaM2: 1.45, rollingResistanceCoeff: 0.011, drivenAxle: 'front', originalEnginePowerKw: 25, ...pack, packNominalVoltageV: 230, packCapacityKwh: 18, packMaxDischargeCurrentA: 250, chargerPowerKw: 3.6 }
  },
  {
    stockRef: 'OF-104', make: 'Morrow', model: 'Fitch Coupé', year: 1969, chassisNumber: 'MF69-11206', registration: 'PYH 905G', intakeDaysAgo: 45,
    status: 'snagging', staged: { daysAgo: 19, time: '16:00' }, platformIndex: 1, ownedByClient: false,
    spec: { kerbMassKg: 1180, frontAxleLoadPct: 53, wheelbaseMm: 2390, cgHeightMm: 500, tyreSize: '185/70 R14 88H', finalDriveRatio: 7.9, drivetrainEfficiency: 0.9, dragCoefficient: 0.40, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 85, ...pack, packCapacityKwh: 38 }
  },
  {
    stockRef: 'OF-105', make: 'Ashcombe', model: 'Fellwalker', year: 1974, chassisNumber: 'AF74-50562', registration: 'GNW 620N', intakeDaysAgo: 2,
    status: 'intake', platformIndex: 2, ownedByClient: false,
    spec: { kerbMassKg: 1890, frontAxleLoadPct: 50, wheelbaseMm: 2540, cgHeightMm: 720, tyreSize: '205/80 R16 104S', finalDriveRatio: 9.5, drivetrainEfficiency: 0.88, dragCoefficient: 0.55, frontalAreaM2: 2.7, rollingResistanceCoeff: 0.012, drivenAxle: 'all', originalEnginePowerKw: 98, ...pack, packNominalVoltageV: 400, packCapacityKwh: 64, packMaxChargeCurrentA: 150, packMaxDischargeCurrentA: 600, chargerPowerKw: 11 }
  },
  {
    stockRef: 'OF-106', make: 'Harrowby', model: 'Tamsin 1300 Saloon', year: 1967, chassisNumber: 'HT67-30984', registration: 'BCE 113E', intakeDaysAgo: 21,
    status: 'converting', platformIndex: 0, ownedByClient: false,
    spec: { kerbMassKg: 1010, frontAxleLoadPct: 54, wheelbaseMm: 2440, cgHeightMm: 520, tyreSize: '165/80 R13 83T', finalDriveRatio: 7.4, drivetrainEfficiency: 0.9, dragCoefficient: 0.45, frontalAreaM2: 1.75, rollingResistanceCoeff: 0.011, drivenAxle: 'rear', originalEnginePowerKw: 43, ...pack, packCapacityKwh: 28 }
  }
]

export const secondWorkshopCar: DemoCar = {
  stockRef: 'SB-001', make: 'Quenby', model: 'Sparrowhawk GT', year: 1970, chassisNumber: 'QS70-00917', registration: 'RWT 77H', intakeDaysAgo: 10,
  status: 'converting', platformIndex: 1, ownedByClient: false,
  spec: { kerbMassKg: 1120, frontAxleLoadPct: 51, wheelbaseMm: 2330, cgHeightMm: 490, tyreSize: '185/70 R14 88H', finalDriveRatio: 7.6, drivetrainEfficiency: 0.9, dragCoefficient: 0.41, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 78, ...pack }
}

// Cars on the drive units whose controllers have settings of their own (seeder 20261203-4002).
export const moreDemoCars: (Omit<DemoCar, 'platformIndex' | 'ownedByClient'> & { platformKey: string })[] = [
  {
    stockRef: 'OF-110', make: 'Lanvey', model: 'Corrick Tourer', year: 1966, chassisNumber: 'LC66-41820', registration: 'HWD 208D', intakeDaysAgo: 6,
    status: 'converting', platformKey: 'quennel-95',
    spec: { kerbMassKg: 1090, frontAxleLoadPct: 54, wheelbaseMm: 2440, cgHeightMm: 510, tyreSize: '175/70 R14 84H', finalDriveRatio: 7.6, drivetrainEfficiency: 0.9, dragCoefficient: 0.43, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 62, ...pack, packCapacityKwh: 36 }
  },
  {
    stockRef: 'OF-111', make: 'Brackley', model: 'Wren Sports', year: 1972, chassisNumber: 'BW72-18733', registration: 'OKV 544K', intakeDaysAgo: 5,
    status: 'converting', platformKey: 'peltry-70',
    spec: { kerbMassKg: 880, frontAxleLoadPct: 50, wheelbaseMm: 2210, cgHeightMm: 460, tyreSize: '165/70 R13 79H', finalDriveRatio: 7.0, drivetrainEfficiency: 0.9, dragCoefficient: 0.41, frontalAreaM2: 1.6, rollingResistanceCoeff: 0.010, drivenAxle: 'rear', originalEnginePowerKw: 48, ...pack, packCapacityKwh: 28 }
  }
]
