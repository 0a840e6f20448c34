import { evaluateRequestSchema } from '../../shared/schemas/evaluate'

// Bounds on what one evaluation may be asked to read: the tune sheet sends a car and 18 settings.
const LIMITS = { maxBytes: 32 * 1024, maxDepth: 5, maxKeys: 300 }

// What a set of controller settings does to a car: errors with their paths, warnings, figures and curves.
export default defineEventHandler(async (event) => {
  await requireSessionCookie(event) // the person is checked with the car, in one round trip
  const input = parseOr400(evaluateRequestSchema, await readSmallJsonBody(event, LIMITS))
  return evaluateRequest(event, input)
})
