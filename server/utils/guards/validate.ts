import type { z } from 'zod'

export interface FieldError { path: string, message: string }

export function zodFieldErrors(error: z.ZodError): FieldError[] {
  return error.issues.map(i => ({ path: i.path.map(String).join('.') || '(body)', message: i.message }))
}

const summary = (fields: FieldError[]) => `Please check: ${fields.map(f => `${f.path} (${f.message})`).join('; ')}`.slice(0, 500)

// Thrown inside h3's validators, which wrap it as a 400 whose `data` is this error's own fields: {fields}.
class ValidationFailure extends Error {
  fields: FieldError[]
  constructor(fields: FieldError[]) {
    super(summary(fields))
    this.fields = fields
  }
}

// PostgreSQL's text cannot hold the character U+0000, so a value or key carrying one is refused where it comes
// in, naming where it is, before it can reach a query and fail there (at most 20 named). Looked for in what
// the schema let through, so a field the schema drops does not hide the one it refuses. No schema nests
// deeper than MAX_DEPTH, so what lies deeper is left to the schema, which refuses it.
const MAX_DEPTH = 16
export function nulFields(input: unknown, path: string[] = [], out: FieldError[] = []): FieldError[] {
  if (out.length >= 20 || path.length > MAX_DEPTH) return out
  const here = () => path.join('.') || '(body)'
  if (typeof input === 'string') {
    if (input.includes('\u0000')) out.push({ path: here(), message: 'Holds a character that cannot be stored (U+0000)' })
  } else if (input && typeof input === 'object') {
    for (const [k, v] of Object.entries(input)) {
      if (k.includes('\u0000')) out.push({ path: [...path, k.replaceAll('\u0000', '')].join('.'), message: 'A name that holds a character that cannot be stored (U+0000)' })
      else nulFields(v, [...path, k], out)
      if (out.length >= 20) break
    }
  }
  return out
}

// For getValidatedQuery / readValidatedBody / getValidatedRouterParams: a 400 naming every field at fault.
// `nulCheck: false` only where a loose first look is followed by a full check that refuses every name it does
// not know and every value that is not a number (the workshop's settings), so that check names the field.
export function zodValidator<S extends z.ZodType>(schema: S, { nulCheck = true }: { nulCheck?: boolean } = {}) {
  return (input: unknown): z.output<S> => {
    const result = schema.safeParse(input)
    if (!result.success) throw new ValidationFailure(zodFieldErrors(result.error))
    const nul = nulCheck ? nulFields(result.data) : []
    if (nul.length) throw new ValidationFailure(nul)
    return result.data
  }
}


// The same answer for a body read another way (e.g. readSmallJsonBody): a 400 naming every field at fault.
export function parseOr400<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input)
  const fields = result.success ? nulFields(result.data) : zodFieldErrors(result.error)
  if (result.success && !fields.length) return result.data
  throw createError({ statusCode: 400, message: summary(fields), data: { fields } })
}
