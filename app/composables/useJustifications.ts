import type { Warning } from '~~/shared/compute/types'

export interface DangerRule { rule: string, warnings: Warning[] }

// Every danger warning needs a written reason before a version goes to review, rule by rule
// (docs/version-lifecycle.md): the submit panel and the roadside form ask for them the same way.
export function useJustifications(warnings: MaybeRefOrGetter<Warning[] | undefined>) {
  const texts = reactive<Record<string, string>>({})
  const fieldErrors = ref<Record<string, string>>({})

  const dangerRules = computed<DangerRule[]>(() => {
    const byRule = new Map<string, Warning[]>()
    for (const w of toValue(warnings) ?? []) if (w.severity === 'danger') byRule.set(w.rule, [...(byRule.get(w.rule) ?? []), w])
    return [...byRule.entries()].map(([rule, list]) => ({ rule, warnings: list }))
  })

  // The reasons to send, or null (with each missing one marked) when a danger has none.
  function collect(): Record<string, string> | null {
    fieldErrors.value = {}
    for (const { rule } of dangerRules.value) if (!texts[rule]?.trim()) fieldErrors.value[rule] = 'Say why this is acceptable on this car'
    if (Object.keys(fieldErrors.value).length) return null
    return Object.fromEntries(dangerRules.value.map(({ rule }) => [rule, texts[rule]!.trim()]))
  }

  // Marks the reasons the server asked for (its 400 names them as justifications.<rule>).
  function fromServer(error: unknown) {
    for (const f of apiError(error).data?.fields ?? []) if (f.path.startsWith('justifications.')) fieldErrors.value[f.path.slice('justifications.'.length)] = f.message
  }

  return { texts, fieldErrors, dangerRules, collect, fromServer }
}
