// Thermal derating: torque available as a sensor warms up (docs/computation.md#derate).

export type DerateSensor = 'motor' | 'inverter' | 'battery'
export const DERATE_SENSORS: readonly DerateSensor[] = ['motor', 'inverter', 'battery']

// 100 % at or below derate start, 0 % at or above cut-off, linear between.
export function torqueAvailablePct(temperatureC: number, derateStartC: number, cutoffC: number): number {
  if (temperatureC >= cutoffC) return 0
  if (temperatureC <= derateStartC) return 100
  return (100 * (cutoffC - temperatureC)) / (cutoffC - derateStartC)
}

// Width of the band over which torque fades, in °C; zero or less means an abrupt cut.
export function derateBandC(derateStartC: number, cutoffC: number): number {
  return cutoffC - derateStartC
}
