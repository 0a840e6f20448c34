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

// For getValidatedQuery / readValidatedBody / getValidatedRouterParams: a 400 naming every field at fault.
export function zodValidator<S extends z.ZodType>(schema: S) {
  return (input: unknown): z.output<S> => {
    const result = schema.safeParse(input)
    if (result.success) return result.data
    throw new ValidationFailure(zodFieldErrors(result.error))
  }
}


// The same answer for a body read another way (e.g. readSmallJsonBody): a 400 naming every field at fault.
export function parseOr400<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input)
  if (result.success) return result.data
  const fields = zodFieldErrors(result.error)
  throw createError({ statusCode: 400, message: summary(fields), data: { fields } })
}
