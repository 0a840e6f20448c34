// The controller's log format (docs/computation.md#log-format): one row per sample, these columns, a header line first.
export const TELEMETRY_COLUMNS = [
  'time_s', 'speed_kph', 'motor_torque_nm', 'motor_rpm', 'pedal_pct', 'brake',
  'motor_c', 'inverter_c', 'battery_c', 'battery_v', 'battery_a'
] as const

export type TelemetryColumn = typeof TELEMETRY_COLUMNS[number]

// One sample. Speed, torque and rpm are signed (negative when the wheels turn backwards);
// battery current is positive when the pack discharges and negative when regen charges it.
export interface TelemetrySample {
  timeS: number
  speedKph: number
  motorTorqueNm: number
  motorRpm: number
  pedalPct: number
  brake: 0 | 1
  motorC: number
  inverterC: number
  batteryC: number
  batteryV: number
  batteryA: number
}

// A row that cannot be read: row counts data rows from 1 (0 is the header), line is the file's line.
export class TelemetryRowError extends Error {
  constructor(readonly row: number, readonly line: number, readonly column: string, detail: string) {
    super(row === 0 ? `Header (line ${line}), column ${column}: ${detail}` : `Row ${row} (line ${line}), column ${column}: ${detail}`)
  }
}

// Plausible bounds a real controller log stays inside; a value outside is a broken row, not a fast car.
const bounds: Record<Exclude<TelemetryColumn, 'brake'>, [number, number]> = {
  time_s: [0, 1e6], speed_kph: [-100, 400], motor_torque_nm: [-5000, 5000], motor_rpm: [-30000, 30000],
  pedal_pct: [0, 100], motor_c: [-60, 250], inverter_c: [-60, 250], battery_c: [-60, 150],
  battery_v: [0, 1500], battery_a: [-3000, 3000]
}

// Header names, trimmed and lower-cased; any missing column is named (extra columns are ignored).
export function missingColumns(header: readonly string[]): TelemetryColumn[] {
  const seen = new Set(header.map(h => h.trim().toLowerCase()))
  return TELEMETRY_COLUMNS.filter(c => !seen.has(c))
}

export function headerIndex(header: readonly string[]): Record<TelemetryColumn, number> {
  const names = header.map(h => h.trim().toLowerCase())
  return Object.fromEntries(TELEMETRY_COLUMNS.map(c => [c, names.indexOf(c)])) as Record<TelemetryColumn, number>
}

function numberAt(cells: readonly string[], index: number, column: TelemetryColumn, row: number, line: number): number {
  const raw = cells[index] ?? ''
  const value = Number(raw) // Number() itself ignores surrounding spaces; an empty or blank cell reads 0
  if (value === 0 && raw.trim() === '') throw new TelemetryRowError(row, line, column, 'is empty')
  if (!Number.isFinite(value)) throw new TelemetryRowError(row, line, column, `"${raw.trim().slice(0, 20)}" is not a number`)
  if (column === 'brake') {
    if (value !== 0 && value !== 1) throw new TelemetryRowError(row, line, column, `must be 0 or 1, not ${raw.trim().slice(0, 20)}`)
    return value
  }
  const range = bounds[column]
  if (value < range[0] || value > range[1]) throw new TelemetryRowError(row, line, column, `${value} is outside ${range[0]} to ${range[1]}`)
  return value
}

// Reads one record (row counts data rows from 1; line is the file's line, the header being line 1).
export function readSample(cells: readonly string[], at: Record<TelemetryColumn, number>, row: number, line: number): TelemetrySample {
  return {
    timeS: numberAt(cells, at.time_s, 'time_s', row, line),
    speedKph: numberAt(cells, at.speed_kph, 'speed_kph', row, line),
    motorTorqueNm: numberAt(cells, at.motor_torque_nm, 'motor_torque_nm', row, line),
    motorRpm: numberAt(cells, at.motor_rpm, 'motor_rpm', row, line),
    pedalPct: numberAt(cells, at.pedal_pct, 'pedal_pct', row, line),
    brake: numberAt(cells, at.brake, 'brake', row, line) as 0 | 1,
    motorC: numberAt(cells, at.motor_c, 'motor_c', row, line),
    inverterC: numberAt(cells, at.inverter_c, 'inverter_c', row, line),
    batteryC: numberAt(cells, at.battery_c, 'battery_c', row, line),
    batteryV: numberAt(cells, at.battery_v, 'battery_v', row, line),
    batteryA: numberAt(cells, at.battery_a, 'battery_a', row, line)
  }
}
