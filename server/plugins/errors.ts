import type { H3Error } from 'h3'

const UNREACHABLE = new Set([
  'SequelizeConnectionError', 'SequelizeConnectionRefusedError', 'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotFoundError', 'SequelizeHostNotReachableError', 'SequelizeConnectionTimedOutError', 'SequelizeAccessDeniedError'
])

function databaseUnreachable(error: unknown): boolean {
  for (let e = error as { name?: string, code?: string, cause?: unknown } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    if (UNREACHABLE.has(e.name ?? '') || e.code === 'ECONNREFUSED' || e.code === '57P01' || e.code === '57P03') return true
  }
  return false
}

// A database that is down answers 503 with a plain message (it recovers by itself when PostgreSQL is back);
// anything else unexpected stays a bare "Server Error" with no stack trace or SQL.
export default defineNitroPlugin((nitroApp) => {
  const handle = nitroApp.h3App.options.onError
  nitroApp.h3App.options.onError = (error: H3Error, event) => {
    if (databaseUnreachable(error)) {
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
