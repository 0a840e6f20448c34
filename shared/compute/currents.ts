// Pack currents and charging (docs/computation.md#currents).

// Battery current at the power cap I = P/(η·V): the pack supplies the drivetrain's losses too.
export function peakDischargeCurrentA(powerCapKw: number, drivetrainEfficiency: number, packVoltageV: number): number {
  return (powerCapKw * 1000) / (drivetrainEfficiency * packVoltageV)
}

// Power the pack can deliver at a current limit, P = I·V·η at the wheels' side of the drivetrain (kW).
export function currentLimitedPowerKw(currentA: number, drivetrainEfficiency: number, packVoltageV: number): number {
  return (currentA * packVoltageV * drivetrainEfficiency) / 1000
}

// Charge time 10 → 80 % = 0.7·capacity/(charger·0.9), 0.9 the charger's efficiency (hours).
export function chargeTime10to80H(packCapacityKwh: number, chargerPowerKw: number): number {
  return (0.7 * packCapacityKwh) / (chargerPowerKw * 0.9)
}

// C-rate: current over the pack's one-hour current (IEC 61434's 1C), for the workshop's reference.
export function cRate(currentA: number, packCapacityKwh: number, packVoltageV: number): number {
  return currentA / ((packCapacityKwh * 1000) / packVoltageV)
}
