import { Readable } from 'node:stream'
import { describe, expect, it } from 'vitest'
import { digestTelemetry } from '../../server/utils/road-tests/telemetry-csv'
import { TelemetryRowError } from '../../shared/telemetry/columns'
import { syntheticDrive, telemetryCsv } from '../../shared/telemetry/synthetic'
import { summarise } from '../../shared/telemetry/summary'

const header = 'time_s,speed_kph,motor_torque_nm,motor_rpm,pedal_pct,brake,motor_c,inverter_c,battery_c,battery_v,battery_a'
const row = (t: number, speed = 36, amps = 10) => `${t},${speed},50,2000,10,0,40,35,25,350,${amps}`

// Feeds text in small, uneven pieces so that a CRLF or a quoted field can fall across two chunks.
function chunks(text: string, size = 7): Readable {
  const parts: Buffer[] = []
  const bytes = Buffer.from(text)
  for (let i = 0; i < bytes.length; i += size) parts.push(bytes.subarray(i, i + size))
  return Readable.from(parts)
}

async function fault(text: string): Promise<TelemetryRowError> {
  try {
    await digestTelemetry(chunks(text))
  } catch (e) {
    if (e instanceof TelemetryRowError) return e
    throw e
  }
  throw new Error('the file was accepted')
}

describe('reading the controller log (RFC 4180)', () => {
  it('reads CRLF line ends, quoted fields, embedded commas and doubled quotes', async () => {
    // RFC 4180 §2: CRLF line breaks (2.1), quoted fields (2.5), commas inside quotes (2.6), "" for a quote (2.7).
    const text = [
      `${header},note`,
      `0,0,"0",0,0,0,20,20,20,350,0,"start, on the hill"`,
      `0.5,"18",60,900,40,0,21,20,20,349,"57.1","driver said ""fine"""`,
      `1.0,36,60,1800,40,0,22,21,20,348,60,plain`
    ].join('\r\n') + '\r\n'
    const { summary } = await digestTelemetry(chunks(text, 5))
    expect(summary.samples).toBe(3)
    expect(summary.durationS).toBe(1)
    expect(summary.peakSpeedKph).toBe(36)
    expect(summary.peakPowerKw).toBeCloseTo(348 * 60 / 1000, 9)
  })

  it('accepts columns in any order, a byte-order mark and a missing final line break', async () => {
    const text = '\uFEFFbattery_a,battery_v,battery_c,inverter_c,motor_c,brake,pedal_pct,motor_rpm,motor_torque_nm,speed_kph,time_s\n10,350,25,35,40,0,10,2000,50,72,0\n10,350,25,35,44,0,10,2000,50,80,0.1'
    const { summary } = await digestTelemetry(chunks(text))
    expect(summary.samples).toBe(2)
    expect(summary.peakSpeedKph).toBe(80)
    expect(summary.peakMotorC).toBe(44)
  })

  it('gives the same summary as the in-memory summariser for a whole synthetic drive', async () => {
    const samples = syntheticDrive({ massKg: 1100, rollingRadiusM: 0.29, finalDriveRatio: 7.2, powerCapKw: 60, torqueCapNm: 220, liftOffDecelMs2: 1.1, brakeRegenDecelMs2: 1.8, packVoltageV: 355, creepSpeedKph: 5 })
    const text = telemetryCsv(samples)
    const { summary, series } = await digestTelemetry(chunks(text, 4096))
    const direct = summarise(samples)
    expect(summary.samples).toBe(samples.length)
    expect(summary.peakSpeedKph).toBeCloseTo(direct.peakSpeedKph!, 2)
    expect(summary.energyOutWh).toBeCloseTo(direct.energyOutWh, 1)
    expect(summary.maxRollbackM).toBeCloseTo(0.08, 2)
    expect(summary.peakLiftOffDecelMs2).toBeCloseTo(1.1, 2)
    expect(series.timeS.length).toBeGreaterThan(100)
    // One chunk of the whole file: the parser slices it, and rows cut at a slice edge still read whole.
    const whole = await digestTelemetry(Readable.from([Buffer.from(text)]))
    expect(whole.summary).toEqual(summary)
  })
})

describe('a bad log names the row and the column', () => {
  it('a value that is not a number', async () => {
    const e = await fault([header, row(0), row(0.1), '0.2,fast,50,2000,10,0,40,35,25,350,10'].join('\n'))
    expect(e).toMatchObject({ row: 3, line: 4, column: 'speed_kph' })
    expect(e.message).toBe('Row 3 (line 4), column speed_kph: "fast" is not a number')
  })

  it('an empty cell, and brake other than 0 or 1', async () => {
    expect(await fault([header, row(0), '0.1,36,,2000,10,0,40,35,25,350,10'].join('\n'))).toMatchObject({ row: 2, column: 'motor_torque_nm' })
    expect(await fault([header, '0,36,50,2000,10,2,40,35,25,350,10'].join('\n'))).toMatchObject({ row: 1, column: 'brake' })
  })

  it('a value outside what a controller can report', async () => {
    expect(await fault([header, row(0), '0.1,36,50,2000,140,0,40,35,25,350,10'].join('\n'))).toMatchObject({ row: 2, column: 'pedal_pct' })
  })

  it('time that does not move forward', async () => {
    expect(await fault([header, row(0), row(0.1), row(0.1)].join('\n'))).toMatchObject({ row: 3, column: 'time_s' })
  })

  it('a header without a needed column', async () => {
    const e = await fault([header.replace(',battery_a', ''), '0,36,50,2000,10,0,40,35,25,350'].join('\n'))
    expect(e).toMatchObject({ row: 0, line: 1, column: 'battery_a' })
    expect(e.message).toMatch(/^Header \(line 1\), column battery_a/)
  })

  it('a row with too few fields, counted after a quoted line break', async () => {
    const e = await fault([`${header},note`, `${row(0)},"two\nlines"`, `${row(0.1)}`].join('\n'))
    expect(e).toMatchObject({ row: 2, line: 4 })
    expect(e.message).toMatch(/has 11 fields where the header has 12/)
  })

  it('an unclosed quote and an empty file', async () => {
    expect((await fault([header, row(0), '0.1,"36,50,2000,10,0,40,35,25,350,10'].join('\n'))).message).toMatch(/quote/i)
    expect((await fault('')).message).toMatch(/empty/)
    expect((await fault(`${header}\n`)).message).toMatch(/no samples/)
  })
})
