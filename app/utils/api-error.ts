// What the server said when a request was refused ({statusCode, message, data}, docs/architecture.md#api),
// read the same way everywhere.
export interface FieldIssue { path: string, message: string }
export interface ApiError<T = Record<string, unknown>> { statusCode?: number, message?: string, data?: T & { fields?: FieldIssue[] } }

export function apiError<T = Record<string, unknown>>(e: unknown): ApiError<T> {
  const err = e as { statusCode?: number, status?: number, data?: { message?: string, data?: T & { fields?: FieldIssue[] } }, message?: string }
  const fields = err?.data?.data?.fields ?? []
  // A refusal by field: the server's summary names the fields by their paths, so say it in their own messages.
  const message = fields.length ? `Some values need a look: ${[...new Set(fields.map(f => f.message))].slice(0, 3).join('; ')}.` : err?.data?.message
  return { statusCode: err?.statusCode ?? err?.status, message, data: err?.data?.data }
}

// The server's plain message, else the fallback (a network error's own text is not for people).
export function errorMessage(e: unknown, fallback: string): string {
  return apiError(e).message ?? fallback
}
