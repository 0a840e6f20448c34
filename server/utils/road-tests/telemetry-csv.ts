// Streams a controller log through csv-parse (RFC 4180: quoted fields, embedded commas, CRLF) into the
// summary and the chart's series. Plain Node, no Nitro: the benchmark and the unit tests import it too.
import { Writable, type Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import { Parser, CsvError } from 'csv-parse'
import { headerIndex, missingColumns, readSample, TelemetryRowError, type TelemetryColumn } from '../../../shared/telemetry/columns'
import { TelemetrySummariser, type TelemetrySummary } from '../../../shared/telemetry/summary'
import { TelemetryDownsampler, type TelemetrySeries } from '../../../shared/telemetry/downsample'

export interface TelemetryDigest { summary: TelemetrySummary, series: TelemetrySeries }

// Handles each record inside csv-parse's own transform, where its line count is exact for that record,
// instead of queuing one object per row (csv-parse's info option allocates one per record: half the time).
const SLICE_BYTES = 16 * 1024

class TelemetryCsvParser extends Parser {
  private fault: Error | null = null
  constructor(private readonly onRecord: (record: string[], line: number) => void) {
    super({ bom: true, skip_empty_lines: true })
  }

  // Parses a large chunk in slices, yielding to the event loop between them, so no request holds it long.
  override _transform(chunk: Buffer, encoding: BufferEncoding, done: (error?: Error | null) => void): void {
    if (chunk.length <= SLICE_BYTES) return super._transform(chunk, encoding, done)
    let offset = 0
    const next = (error?: Error | null) => {
      if (error || this.fault || offset >= chunk.length) return done(error ?? null)
      const slice = chunk.subarray(offset, offset + SLICE_BYTES)
      offset += SLICE_BYTES
      super._transform(slice, encoding, offset >= chunk.length ? done : e => (e ? done(e) : setImmediate(next)))
    }
    next()
  }

  override push(record: unknown): boolean {
    if (record === null) return super.push(null)
    if (this.fault) return true
    try {
      this.onRecord(record as string[], this.info.lines)
    } catch (e) {
      this.fault = e as Error
      this.destroy(this.fault)
    }
    return true
  }
}

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
  const summariser = new TelemetrySummariser()
  const downsampler = new TelemetryDownsampler()
  let header: string[] | null = null
  let index: Record<TelemetryColumn, number> | null = null
  let row = 0
  const parser = new TelemetryCsvParser((record, line) => {
    if (!header) {
      header = record
      const missing = missingColumns(record)
      if (missing.length) throw new TelemetryRowError(0, line, missing.join(', '), `missing from the header (it needs ${missing.length === 1 ? 'this column' : 'these columns'})`)
      index = headerIndex(record)
      return
    }
    row++
    const sample = readSample(record, index!, row, line)
    try {
      summariser.add(sample)
    } catch (e) {
      throw new TelemetryRowError(row, line, 'time_s', (e as Error).message)
    }
    downsampler.add(sample)
  })
  try {
    await pipeline(input, parser, new Writable({ objectMode: true, write: (_r, _e, done) => done() }))
  } catch (e) {
    if (e instanceof CsvError) throw csvFault(e, header)
    throw e
  }
  if (!header) throw new TelemetryRowError(0, 1, 'time_s', 'the file is empty: a header line is needed')
  if (row === 0) throw new TelemetryRowError(1, 2, 'time_s', 'the log has no samples after the header')
  return { summary: summariser.result(), series: downsampler.result() }
}
