// A mandatory road-test check's measured values in words, in the order its guide lists them (JSONB keeps no
// order) and rounded as the trade writes them: "Gradient 14 %", "Deceleration 0.80 m/s²", then how it felt.
import { checkGuides } from '../schemas/road-test-checks'
import { keyLabel, numberText, valueText } from './audit-values'
import { localeNumber } from './number-format'

const present = (x: unknown) => x !== null && x !== undefined && x !== ''

export function measuredValues(key: string, values: Record<string, unknown> | null | undefined): string[] {
  const v = values ?? {}
  const fields = (checkGuides.find(g => g.key === key)?.fields ?? []).filter(f => typeof v[f.name] === 'number')
  const numbers = fields.map((f) => {
    const x = v[f.name] as number
    const text = f.unit === 'm/s²' ? numberText(x, 2) : localeNumber(x, { maximumFractionDigits: f.step < 1 ? 1 : 0 })
    return `${f.label.replace(/, if measured$/, '')} ${text} ${f.unit}`
  })
  const others = Object.entries(v).filter(([k, x]) => present(x) && !fields.some(f => f.name === k))
    .map(([k, x]) => (k === 'feel' ? `felt ${String(x)}` : `${keyLabel(k).replace(/, .*$/, '')} ${valueText(x, k)}`))
  return [...numbers, ...others]
}
