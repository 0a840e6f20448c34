import type { H3Error } from 'h3'

const UNREACHABLE = new Set([
  'SequelizeConnectionError', 'SequelizeConnectionRefusedError', 'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotFoundError', 'SequelizeHostNotReachableError', 'SequelizeConnectionTimedOutError', 'SequelizeAccessDeniedError'
])

// Connection refused, reset or terminated by a shutdown (SQLSTATE class 08 and 57P01-57P03).
const LOST_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08001', '08003', '08006'])
const LOST_MESSAGE = /Connection terminated|not queryable|terminating connection|the database system is (shutting down|starting up)/i

interface Cause { name?: string, code?: string, message?: string, cause?: Cause, parent?: Cause, original?: Cause }

function databaseUnreachable(error: Cause | undefined, depth = 0): boolean {
  if (!error || depth > 6) return false
  if (UNREACHABLE.has(error.name ?? '') || LOST_CODES.has(error.code ?? '') || LOST_MESSAGE.test(error.message ?? '')) return true
  return [error.cause, error.parent, error.original].some(c => c !== error && databaseUnreachable(c, depth + 1))
}

// A database that is down answers 503 with a plain message (it recovers by itself when PostgreSQL is back);
// anything else unexpected stays a bare "Server Error" with no stack trace or SQL.
export default defineNitroPlugin((nitroApp) => {
  const handle = nitroApp.h3App.options.onError
  nitroApp.h3App.options.onError = (error: H3Error, event) => {
    if (databaseUnreachable(error as Cause)) {
      error.statusCode = 503
      error.statusMessage = 'Service Unavailable'
      error.message = 'The database cannot be reached just now. Nothing was changed; please try again in a moment.'
      error.unhandled = false
      error.data = undefined
      setResponseHeader(event, 'Retry-After', 5)
    }
    return handle?.(error, event)
  }
})
