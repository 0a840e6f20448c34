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

  // Checks the value, then sends it: `saving` while it goes, a refusal shown by field. Answers what the send
  // answered, or undefined when the value or the server refused it.
  const saving = ref(false)
  async function submit<T>(value: unknown, send: (input: z.output<S>) => Promise<T>): Promise<T | undefined> {
    const input = validate(value)
    if (!input || saving.value) return undefined
    saving.value = true
    try {
      return await send(input)
    } catch (e) {
      fromServer(e)
      return undefined
    } finally {
      saving.value = false
    }
  }

  return { errors, formMessage, validate, fromServer, saving, submit }
}
