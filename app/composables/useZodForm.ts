import type { z } from 'zod'


// Validates a form with the same zod schema as the route that receives it, and keeps the
// messages by field so each one shows beside the field that holds the wrong value.
export function useZodForm<S extends z.ZodType>(schema: S) {
  const errors = ref<Record<string, string>>({})
  const formMessage = ref('')

  function validate(value: unknown): z.output<S> | null {
    const result = schema.safeParse(value)
    errors.value = {}
    formMessage.value = ''
    if (result.success) return result.data
    for (const issue of result.error.issues) {
      const key = issue.path.map(String).join('.')
      errors.value[key] ??= issue.message
    }
    formMessage.value = 'Some values need a look: they are marked below.'
    return null
  }

  // Shows a server's 400/409 answer ({data: {fields}}) the same way.
  function fromServer(error: unknown) {
    const e = apiError(error)
    errors.value = {}
    for (const f of e.data?.fields ?? []) errors.value[f.path] ??= f.message
    formMessage.value = e.message ?? 'The change could not be saved.'
  }

  return { errors, formMessage, validate, fromServer }
}
