// A fictional small rear-driven saloon of the late 1960s, converted; for the tune sheet's first run,
// the tests and the benchmark. Also the fallback for a spec field that cannot be read.
import type { VehicleSpec } from '../schemas/vehicle-spec'

export const exampleSpec: VehicleSpec = {
  kerbMassKg: 980,
  payloadKg: 150,
  frontAxleLoadPct: 53,
  wheelbaseMm: 2400,
  cgHeightMm: 520,
  tyreSize: '165/80 R15 86S',
  finalDriveRatio: 7.2,
  drivetrainEfficiency: 0.9,
  dragCoefficient: 0.42,
  frontalAreaM2: 1.8,
  rollingResistanceCoeff: 0.011,
  rotatingMassFactor: 1.05,
  drivenAxle: 'rear',
  originalEnginePowerKw: 55,
  packNominalVoltageV: 355,
  packCapacityKwh: 38,
  packMaxChargeCurrentA: 110,
  packMaxDischargeCurrentA: 350,
  chargerPowerKw: 7.4
}
