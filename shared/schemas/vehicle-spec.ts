import { z } from 'zod'

// ISO metric tyre designation with service description, e.g. "155/80 R15 82S" (ISO 4000-1).
export const TYRE_DESIGNATION = /^\s*(\d{3})\/(\d{2,3})\s*Z?R\s*(\d{2})\s+(\d{2,3})\s*([A-Z])\s*$/i

const tyre = z.string().trim().regex(TYRE_DESIGNATION, 'Write the size as on the sidewall, e.g. 155/80 R15 82S')

const positive = (max: number) => z.number({ error: 'A number is needed' }).positive('Must be above zero').max(max, `At most ${max}`)

export const drivenAxles = ['front', 'rear', 'all'] as const

// The chassis and drivetrain facts that decide what is safe for this car (docs/computation.md#car-facts).
export const vehicleSpecSchema = z.object({
  kerbMassKg: positive(4000),
  payloadKg: z.number().min(0, 'Cannot be negative').max(1500).default(150),
  frontAxleLoadPct: z.number().min(20, 'At least 20 %').max(80, 'At most 80 %'),
  wheelbaseMm: z.number().min(1500, 'At least 1500 mm').max(4500, 'At most 4500 mm'),
  cgHeightMm: z.number().min(250, 'At least 250 mm').max(1200, 'At most 1200 mm'),
  tyreSize: tyre,
  tyreSizeFront: tyre.optional(),
  tyreSizeRear: tyre.optional(),
  finalDriveRatio: positive(30),
  drivetrainEfficiency: z.number().gt(0, 'Must be above zero').max(1, 'At most 1 (100 %)'),
  dragCoefficient: z.number().min(0.15, 'At least 0.15').max(1.2, 'At most 1.2'),
  frontalAreaM2: z.number().min(0.8, 'At least 0.8 m²').max(5, 'At most 5 m²'),
  rollingResistanceCoeff: z.number().min(0.004, 'At least 0.004').max(0.05, 'At most 0.05'),
  rotatingMassFactor: z.number().min(1, 'At least 1').max(1.5, 'At most 1.5').default(1.05),
  drivenAxle: z.enum(drivenAxles, { error: 'Choose front, rear or all' }),
  originalEnginePowerKw: positive(1000),
  packNominalVoltageV: positive(1000),
  packCapacityKwh: positive(300),
  packMaxChargeCurrentA: positive(2000),
  packMaxDischargeCurrentA: positive(3000),
  chargerPowerKw: positive(400)
})

export type VehicleSpec = z.output<typeof vehicleSpecSchema>
export type VehicleSpecInput = z.input<typeof vehicleSpecSchema>
