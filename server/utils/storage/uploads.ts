// Receives one file from a multipart/form-data request as a stream (busboy), never buffering it whole.
import type { H3Event } from 'h3'
import type { Readable } from 'node:stream'
import busboy from 'busboy'

export interface IncomingFile { stream: Readable, filename: string, mimeType: string }

// Errors the upload routes answer with their own status codes.
export class UploadRefused extends Error {
  constructor(readonly statusCode: 413 | 415 | 422 | 400, message: string, readonly data: Record<string, unknown> = {}) {
    super(message)
  }
}

export const megabytes = (n: number) => n * 1024 * 1024
const ENVELOPE_BYTES = 64 * 1024 // room for the multipart boundaries and part headers

// Calls `handle` with the file in `field`; when it fails, the rest of the request is read and dropped
// so the client still gets the answer. Fields other than the file are ignored (send them in the query).
export function receiveUpload<T>(event: H3Event, opts: { field: string, maxBytes: number }, handle: (file: IncomingFile) => Promise<T>): Promise<T> {
  const req = event.node.req
  const type = String(req.headers['content-type'] ?? '')
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    return Promise.reject(new UploadRefused(415, `Send the file as multipart/form-data in the field "${opts.field}".`))
  }
  const declared = Number(req.headers['content-length'])
  if (Number.isFinite(declared) && declared > opts.maxBytes + ENVELOPE_BYTES) {
    return Promise.reject(tooLarge(opts.maxBytes))
  }
  let bb: busboy.Busboy
  try {
    // File names as UTF-8 (RFC 7578 section 4.2), not busboy's default of Latin-1.
    bb = busboy({ headers: req.headers, defParamCharset: 'utf8', limits: { files: 1, fileSize: opts.maxBytes, fields: 20, fieldSize: 16 * 1024 } })
  } catch {
    return Promise.reject(new UploadRefused(400, `The upload has no multipart boundary; send the file as multipart/form-data in the field "${opts.field}".`))
  }
  return new Promise<T>((resolve, reject) => {
    let settled = false
    let started = false
    const finish = (fn: () => void) => {
      if (settled) return
      settled = true
      fn()
    }
    const drop = () => {
      req.unpipe(bb)
      req.resume()
    }
    bb.on('file', (name, stream, info) => {
      if (name !== opts.field || started) return stream.resume()
      started = true
      stream.on('limit', () => stream.destroy(tooLarge(opts.maxBytes)))
      handle({ stream, filename: printable(info.filename ?? ''), mimeType: (info.mimeType ?? '').toLowerCase() }).then(
        value => finish(() => resolve(value)),
        (e) => {
          stream.destroy()
          drop()
          finish(() => reject(e))
        })
    })
    bb.on('close', () => {
      if (!started) finish(() => reject(new UploadRefused(400, `No file was sent in the field "${opts.field}".`, { fields: [{ path: opts.field, message: 'A file is needed' }] })))
    })
    bb.on('error', (e: Error) => {
      drop()
      finish(() => reject(new UploadRefused(400, `The upload could not be read: ${e.message}`)))
    })
    req.pipe(bb)
  })
}

export function tooLarge(maxBytes: number) {
  return new UploadRefused(413, `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`, { maxBytes })
}

// The answer an upload route gives for each refusal.
export function uploadError(e: unknown): never {
  if (e instanceof UploadRefused) throw createError({ statusCode: e.statusCode, message: e.message, data: e.data })
  throw e
}

// A file name without control characters: U+0000 cannot be stored, and the rest mean nothing in a name.
function printable(name: string): string {
  return [...name].filter((ch) => { const c = ch.codePointAt(0)!; return c >= 0x20 && c !== 0x7f }).join('')
}

// An ASCII stand-in for old clients and the exact UTF-8 name for the rest (RFC 6266 section 4.3, RFC 8187).
export function contentDisposition(kind: 'inline' | 'attachment', filename: string): string {
  const exact = encodeURIComponent(filename).replace(/['()*]/g, c => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)
  return `${kind}; filename="${filename.replace(/[^\w.-]/g, '_')}"; filename*=UTF-8''${exact}`
}
