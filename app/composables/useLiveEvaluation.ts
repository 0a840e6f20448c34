// Evaluates a profile on a car in the browser as the tuner types: the same shared computation the
// server runs, without ajv (no code generation, so it works under a strict content security policy).
import { evaluate, type Evaluation, type PlatformLike, type WorkshopSettings } from '~~/shared/compute'
import type { VehicleSpec } from '~~/shared/schemas/vehicle-spec'

export interface LiveEvaluationOptions { delayMs?: number }

export function useLiveEvaluation(
  spec: MaybeRefOrGetter<VehicleSpec>,
  platform: MaybeRefOrGetter<PlatformLike>,
  parameters: MaybeRefOrGetter<Record<string, unknown>>,
  settings: MaybeRefOrGetter<WorkshopSettings | undefined> = undefined,
  options: LiveEvaluationOptions = {}
) {
  const delayMs = options.delayMs ?? 120
  const failure = ref('')
  const lastMs = ref(0)
  const pending = ref(false)

  function run(): Evaluation | null {
    const started = performance.now()
    try {
      const result = evaluate(toValue(spec), toValue(platform), toValue(parameters), toValue(settings))
      failure.value = ''
      return result
    } catch (e) {
      // The computation is written never to throw; if it ever does, keep the last good figures on screen.
      failure.value = `The figures could not be worked out: ${(e as Error).message}`
      return null
    } finally {
      lastMs.value = performance.now() - started
    }
  }

  const evaluation = shallowRef<Evaluation | null>(run())
  let timer: ReturnType<typeof setTimeout> | undefined

  function schedule() {
    pending.value = true
    if (timer) clearTimeout(timer)
    timer = setTimeout(now, delayMs)
  }

  // Evaluate at once, e.g. before a version is saved.
  function now() {
    if (timer) clearTimeout(timer)
    timer = undefined
    pending.value = false
    evaluation.value = run() ?? evaluation.value
  }

  watch(() => [toValue(spec), toValue(platform), toValue(parameters), toValue(settings)], schedule, { deep: true })
  onScopeDispose(() => { if (timer) clearTimeout(timer) })

  return { evaluation, pending, failure, lastMs, now }
}
