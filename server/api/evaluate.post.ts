import { evaluateRequestSchema } from '../../shared/schemas/evaluate'

// What a set of controller settings does to a car: errors with their paths, warnings, figures and curves.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const input = await readValidatedBody(event, zodValidator(evaluateRequestSchema))
  return evaluateRequest(event, input)
})
