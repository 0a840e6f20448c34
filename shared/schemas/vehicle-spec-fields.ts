import type { VehicleSpec } from './vehicle-spec'

export interface SpecField {
  key: keyof VehicleSpec
  label: string
  unit?: string
  step?: number
  kind?: 'number' | 'tyre' | 'axle'
  help: string
}

// The spec sheet in the order a workshop reads a car: mass, chassis, tyres, drivetrain, pack.
export const specGroups: { title: string, fields: SpecField[] }[] = [
  { title: 'Mass and chassis', fields: [
    { key: 'kerbMassKg', label: 'Kerb mass (converted)', unit: 'kg', step: 1, help: 'Weighed after conversion, with the pack fitted.' },
    { key: 'payloadKg', label: 'Test payload', unit: 'kg', step: 1, help: 'Driver and passenger for the checks; 150 kg unless you know better.' },
    { key: 'frontAxleLoadPct', label: 'Static load on the front axle', unit: '%', step: 0.5, help: 'From the corner weights.' },
    { key: 'wheelbaseMm', label: 'Wheelbase', unit: 'mm', step: 1, help: 'Centre of front hub to centre of rear hub.' },
    { key: 'cgHeightMm', label: 'Centre-of-gravity height', unit: 'mm', step: 1, help: 'Measured by tilting, or estimated.' }
  ] },
  { title: 'Tyres', fields: [
    { key: 'tyreSize', label: 'Tyre size', kind: 'tyre', help: 'As on the sidewall, e.g. 155/80 R15 82S.' },
    { key: 'tyreSizeFront', label: 'Front tyre size, if different', kind: 'tyre', help: 'Leave empty when all four match.' },
    { key: 'tyreSizeRear', label: 'Rear tyre size, if different', kind: 'tyre', help: 'Leave empty when all four match.' }
  ] },
  { title: 'Drivetrain and body', fields: [
    { key: 'drivenAxle', label: 'Driven axle', kind: 'axle', help: 'Which wheels the motor drives.' },
    { key: 'finalDriveRatio', label: 'Overall reduction', unit: ': 1', step: 0.01, help: 'Motor revolutions per wheel revolution.' },
    { key: 'drivetrainEfficiency', label: 'Drivetrain efficiency', unit: '0–1', step: 0.01, help: 'Motor shaft to wheel; 0.9 is typical for a single reduction.' },
    { key: 'rotatingMassFactor', label: 'Rotating mass factor', unit: '×', step: 0.01, help: 'Extra inertia of wheels and motor; 1.05 unless measured.' },
    { key: 'dragCoefficient', label: 'Drag coefficient', unit: 'Cd', step: 0.01, help: 'Period figure or estimate.' },
    { key: 'frontalAreaM2', label: 'Frontal area', unit: 'm²', step: 0.01, help: 'Width × height × 0.85 is a fair estimate.' },
    { key: 'rollingResistanceCoeff', label: 'Rolling resistance', unit: 'Crr', step: 0.001, help: 'About 0.010 for period radials.' },
    { key: 'originalEnginePowerKw', label: 'Original engine power', unit: 'kW', step: 0.5, help: 'What the chassis, brakes and tyres were built for.' }
  ] },
  { title: 'Battery pack and charging', fields: [
    { key: 'packNominalVoltageV', label: 'Pack nominal voltage', unit: 'V', step: 1, help: 'From the pack label.' },
    { key: 'packCapacityKwh', label: 'Pack capacity', unit: 'kWh', step: 0.1, help: 'Usable energy.' },
    { key: 'packMaxChargeCurrentA', label: 'Pack max charge current', unit: 'A', step: 1, help: 'Continuous, from the pack maker; regen counts as charging.' },
    { key: 'packMaxDischargeCurrentA', label: 'Pack max discharge current', unit: 'A', step: 1, help: 'Continuous, from the pack maker.' },
    { key: 'chargerPowerKw', label: 'On-board charger power', unit: 'kW', step: 0.1, help: 'AC charging power.' }
  ] }
]
