// Streams a controller log through csv-parse (RFC 4180: quoted fields, embedded commas, CRLF) into the
// summary and the chart's series. Plain Node, no Nitro: the benchmark and the unit tests import it too.
import { Writable, type Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import { parse, CsvError } from 'csv-parse'
import { headerIndex, missingColumns, readSample, TelemetryRowError, type TelemetryColumn } from '../../shared/telemetry/columns'
import { TelemetrySummariser, type TelemetrySummary } from '../../shared/telemetry/summary'
import { TelemetryDownsampler, type TelemetrySeries } from '../../shared/telemetry/downsample'

export interface TelemetryDigest { summary: TelemetrySummary, series: TelemetrySeries }

interface Parsed { record: string[], info: { lines: number, records: number } }

function csvFault(e: CsvError, header: string[] | null): TelemetryRowError {
  const ctx = e as CsvError & { lines?: number, records?: number, index?: number }
  const line = ctx.lines ?? 0
  const column = header?.[ctx.index ?? -1] ?? (ctx.index !== undefined ? `field ${ctx.index + 1}` : 'record')
  const detail = e.code === 'CSV_RECORD_INCONSISTENT_FIELDS_LENGTH'
    ? `has ${(e as unknown as { record?: unknown[] }).record?.length ?? '?'} fields where the header has ${header?.length ?? '?'}`
    : e.message.replace(/^[^:]*:\s*/, '')
  // records counts the header too, so the faulty record's data-row number is records.
  return new TelemetryRowError(ctx.records ?? Math.max(0, line - 1), line, column, detail)
}

export async function digestTelemetry(input: Readable): Promise<TelemetryDigest> {
  const parser = parse({ bom: true, skip_empty_lines: true, info: true, relax_quotes: false })
  const summariser = new TelemetrySummariser()
  const downsampler = new TelemetryDownsampler()
  let header: string[] | null = null
  let index: Record<TelemetryColumn, number> | null = null
  let row = 0
  const sink = new Writable({
    objectMode: true,
    highWaterMark: 256,
    write({ record, info }: Parsed, _enc, done) {
      try {
        if (!header) {
          header = record
          const missing = missingColumns(record)
          if (missing.length) throw new TelemetryRowError(0, info.lines, missing.join(', '), `missing from the header (it needs ${missing.length === 1 ? 'this column' : 'these columns'})`)
          index = headerIndex(record)
          return done()
        }
        row++
        const sample = readSample(record, index!, row, info.lines)
        try {
          summariser.add(sample)
        } catch (e) {
          throw new TelemetryRowError(row, info.lines, 'time_s', (e as Error).message)
        }
        downsampler.add(sample)
        done()
      } catch (e) {
        done(e as Error)
      }
    }
  })
  try {
    await pipeline(input, parser, sink)
  } catch (e) {
    if (e instanceof CsvError) throw csvFault(e, header)
    throw e
  }
  if (!header) throw new TelemetryRowError(0, 1, 'time_s', 'the file is empty: a header line is needed')
  if (row === 0) throw new TelemetryRowError(1, 2, 'time_s', 'the log has no samples after the header')
  return { summary: summariser.result(), series: downsampler.result() }
}
