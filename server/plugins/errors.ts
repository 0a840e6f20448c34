import { STATUS_CODES } from 'node:http'
import type { H3Error, H3Event } from 'h3'

const UNREACHABLE = new Set([
  'SequelizeConnectionError', 'SequelizeConnectionRefusedError', 'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotFoundError', 'SequelizeHostNotReachableError', 'SequelizeConnectionTimedOutError', 'SequelizeAccessDeniedError'
])

// Connection refused, reset or terminated by a shutdown (SQLSTATE class 08 and 57P01-57P03).
const LOST_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08001', '08003', '08006'])
const LOST_MESSAGE = /Connection terminated|not queryable|terminating connection|the database system is (shutting down|starting up)/i

interface Cause { name?: string, code?: string, message?: string, cause?: Cause, parent?: Cause, original?: Cause, objectStore?: boolean, $metadata?: { httpStatusCode?: number } }

// The object store refused, dropped or timed out the connection, or answered 5xx (marked in server/utils/storage/object-store.ts).
const STORE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN'])
function storeUnreachable(error: Cause | undefined, depth = 0): boolean {
  if (!error || depth > 6) return false
  if (error.objectStore && (STORE_CODES.has(error.code ?? '') || error.name === 'TimeoutError' || (error.$metadata?.httpStatusCode ?? 0) >= 500)) return true
  return [error.cause, error.parent, error.original].some(c => c !== error && storeUnreachable(c, depth + 1))
}

function databaseUnreachable(error: Cause | undefined, depth = 0): boolean {
  if (!error || depth > 6) return false
  if (UNREACHABLE.has(error.name ?? '') || LOST_CODES.has(error.code ?? '') || LOST_MESSAGE.test(error.message ?? '')) return true
  return [error.cause, error.parent, error.original].some(c => c !== error && databaseUnreachable(c, depth + 1))
}

function unavailable(error: H3Error, event: H3Event, message: string) {
  error.statusCode = 503
  error.statusMessage = 'Service Unavailable'
  error.message = message
  error.unhandled = false
  error.data = undefined
  setResponseHeader(event, 'Retry-After', 5)
}

// A database or object store that is down answers 503 with a plain message (the product recovers by itself
// when it is back); anything else unexpected stays a bare "Server Error" with no stack trace or SQL.
export default defineNitroPlugin((nitroApp) => {
  const handle = nitroApp.h3App.options.onError
  nitroApp.h3App.options.onError = (error: H3Error, event) => {
    if (storeUnreachable(error as Cause)) unavailable(error, event, 'The file store cannot be reached just now. Nothing was stored; please try again in a moment.')
    else if (databaseUnreachable(error as Cause)) unavailable(error, event, 'The database cannot be reached just now. Nothing was changed; please try again in a moment.')
    // A refusal made with a status alone reads as its own reason ("401 Unauthorized"), not "Server Error".
    else if (!error.statusMessage && error.statusCode < 500) error.statusMessage = STATUS_CODES[error.statusCode] ?? ''
    return handle?.(error, event)
  }
})
