// Canonical JSON: keys sorted at every level (by UTF-16 code units), no whitespace, so equal content always
// hashes the same. Written as plain loops: the chain verifier runs it on every event.
export function canonicalJson(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value)
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : 'null'
  if (value === null || typeof value !== 'object') {
    if (typeof value === 'number' && !Number.isFinite(value)) return 'null'
    return JSON.stringify(value ?? null)
  }
  if (value instanceof Date) return JSON.stringify(value.toISOString())
  if (Array.isArray(value)) {
    let out = '['
    for (let i = 0; i < value.length; i++) out += (i ? ',' : '') + canonicalJson(value[i])
    return `${out}]`
  }
  const record = value as Record<string, unknown>
  const keys = Object.keys(record).sort()
  let out = '{'
  let first = true
  for (const k of keys) {
    const v = record[k]
    if (v === undefined) continue
    out += `${first ? '' : ','}${JSON.stringify(k)}:${canonicalJson(v)}`
    first = false
  }
  return `${out}}`
}
