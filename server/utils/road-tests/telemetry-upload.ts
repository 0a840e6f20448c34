// A road test's controller log: streamed at once into object storage and through the CSV reader; stored
// (object, attachment row, telemetry row, audit event) only when every part succeeded, else nothing is.
import { createHash } from 'node:crypto'
import { PassThrough, Transform } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import type { H3Event } from 'h3'
import { Attachment, TelemetryLog } from '../../models'
import type { SignedIn } from '../guards/guards'
import { TelemetryRowError } from '../../../shared/telemetry/columns'
import { digestTelemetry, type TelemetryDigest } from './telemetry-csv'
import { megabytes, receiveUpload, UploadRefused, type IncomingFile } from '../storage/uploads'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { findRoadTest, attachmentView } from './record'
import { newObjectKey, startObjectUpload, deleteObjects } from '../storage/object-store'

export const TELEMETRY_MAX_BYTES = megabytes(50)
const CSV_TYPES = ['text/csv', 'text/plain', 'application/csv', 'text/comma-separated-values', 'application/vnd.ms-excel', 'text/x-csv']
// Signatures of files that are certainly not text: PDF, PNG, JPEG, GIF, ZIP (and so XLSX), gzip.
const BINARY_MAGIC = [[0x25, 0x50, 0x44, 0x46], [0x89, 0x50, 0x4e, 0x47], [0xff, 0xd8, 0xff], [0x47, 0x49, 0x46, 0x38], [0x50, 0x4b, 0x03, 0x04], [0x1f, 0x8b]]

const notCsv = (why: string) => new UploadRefused(415, `This is not a CSV log: ${why}. Export the controller's log as CSV.`)

function checkDeclaredType(file: IncomingFile) {
  const csvName = /\.(csv|txt|log)$/i.test(file.filename)
  if (CSV_TYPES.includes(file.mimeType) || (file.mimeType === 'application/octet-stream' && csvName)) return
  throw notCsv(`the file is ${file.mimeType || 'of no stated type'}`)
}

function looksBinary(chunk: Buffer): boolean {
  if (BINARY_MAGIC.some(m => m.every((b, i) => chunk[i] === b))) return true
  return chunk.subarray(0, 4096).includes(0)
}

// Hashes, counts and sniffs the bytes on their way through.
function inspector() {
  const hash = createHash('sha256')
  let bytes = 0
  const stream = new Transform({
    transform(chunk: Buffer, _enc, done) {
      if (bytes === 0 && looksBinary(chunk)) return done(notCsv('its content is binary'))
      bytes += chunk.length
      hash.update(chunk)
      done(null, chunk)
    }
  })
  return { stream, result: () => ({ bytes, sha256: hash.digest('hex') }) }
}

async function storeAndDigest(file: IncomingFile, key: string) {
  checkDeclaredType(file)
  const inspect = inspector()
  const toStore = new PassThrough()
  const toParse = new PassThrough()
  inspect.stream.pipe(toStore)
  inspect.stream.pipe(toParse)
  const upload = startObjectUpload(key, toStore, 'text/csv')
  const tasks = [pipeline(file.stream, inspect.stream), digestTelemetry(toParse), upload.done()] as const
  tasks.forEach(p => p.catch(() => {})) // the first failure is handled below; the rest are its echoes
  try {
    const [, digest] = await Promise.all(tasks)
    return { digest: digest as TelemetryDigest, ...inspect.result() }
  } catch (e) {
    for (const s of [file.stream, inspect.stream, toStore, toParse]) s.destroy()
    await upload.abort().catch(() => {})
    await deleteObjects([key])
    throw e
  }
}

function refusal(e: unknown): never {
  if (e instanceof TelemetryRowError) {
    throw new UploadRefused(422, `The log could not be read. ${e.message}.`, { row: e.row, line: e.line, column: e.column })
  }
  throw e
}

export async function uploadTelemetry(event: H3Event, user: SignedIn, roadTestId: number) {
  const rt = await findRoadTest(user, roadTestId)
  if (rt.signed) throw createError({ statusCode: 409, message: 'This road test is signed off; its record, log included, can no longer change.' })
  return receiveUpload(event, { field: 'file', maxBytes: TELEMETRY_MAX_BYTES }, async (file) => {
    const key = newObjectKey('telemetry')
    const stored = await storeAndDigest(file, key).catch(refusal)
    try {
      return await useDatabase().transaction(async (transaction) => {
        const locked = await findRoadTest(user, roadTestId, transaction, true)
        if (locked.signed) throw createError({ statusCode: 409, message: 'This road test was signed off while the log was uploading.' })
        const attachment = await Attachment.create({
          workshopId: user.workshopId, ownerType: 'telemetry', ownerId: rt.id, objectKey: key, filename: file.filename.slice(0, 200) || 'log.csv',
          contentType: 'text/csv', bytes: stored.bytes, sha256: stored.sha256, uploadedBy: user.id
        }, { transaction })
        const log = await TelemetryLog.create({
          workshopId: user.workshopId, roadTestId: rt.id, attachmentId: attachment.id, sampleCount: stored.digest.summary.samples,
          summary: stored.digest.summary as unknown as Record<string, number | null>, series: stored.digest.series as unknown as Record<string, number[]>
        }, { transaction })
        await appendAuditEvent(transaction, {
          workshopId: user.workshopId, vehicleId: rt.vehicleId, actorId: user.id, action: 'road-test.telemetry-uploaded', entityType: 'road-test', entityId: rt.id,
          data: { telemetryLogId: log.id, attachmentId: attachment.id, filename: attachment.filename, bytes: stored.bytes, sha256: stored.sha256, summary: stored.digest.summary }
        })
        return { id: log.id, roadTestId: rt.id, attachment: attachmentView(attachment), summary: stored.digest.summary }
      })
    } catch (e) {
      await deleteObjects([key])
      throw e
    }
  })
}
