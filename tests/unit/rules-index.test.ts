import { describe, expect, it } from 'vitest'
import { evaluate } from '../../shared/compute/evaluate'
import { exampleSpec } from '../../shared/compute/example'
import { DEFER, rules, runRules } from '../../shared/compute/rules/index'
import { defaultSettings, workshopSettingsSchema } from '../../shared/compute/settings'
import { RULE_IDS } from '../../shared/compute/types'
import { ulvane220, defaultParameters, marrick110 } from '../../shared/platforms/index'

describe('the rule set', () => {
  it('has exactly the ten rule ids of docs/computation.md#rules', () => {
    expect(Object.keys(rules)).toEqual([...RULE_IDS])
    expect([...RULE_IDS].sort()).toEqual(['creep-hold', 'current-limits', 'derate-band', 'hill-start', 'power-ratio', 'regen-grip-snow',
      'regen-grip-wet', 'stop-lamp', 'tyre-load', 'tyre-speed'])
  })

  it('a risky profile trips several rules, each warning well formed and deferring to regulations and an engineer', () => {
    const e = evaluate(exampleSpec, ulvane220, { ...defaultParameters(ulvane220), liftOffRegenPct: 60, motorDerateStartC: 155 })
    const ids = new Set(e.warnings.map(w => w.rule))
    for (const id of ['power-ratio', 'current-limits', 'stop-lamp', 'regen-grip-wet', 'regen-grip-snow', 'derate-band']) expect(ids).toContain(id)
    for (const w of e.warnings) {
      expect(RULE_IDS).toContain(w.rule)
      expect(['info', 'caution', 'danger']).toContain(w.severity)
      expect(Number.isFinite(w.value) && Number.isFinite(w.limit)).toBe(true)
      expect(w.message.endsWith(DEFER)).toBe(true)
      expect(w.message).toMatch(/regulations/)
      expect(w.message).toMatch(/qualified engineer/)
    }
  })

  it('thresholds come from the workshop settings', () => {
    const e = evaluate(exampleSpec, marrick110, defaultParameters(marrick110))
    const x = { figures: e.figures, parameters: defaultParameters(marrick110), spec: exampleSpec }
    expect(runRules({ ...x, settings: defaultSettings }).some(w => w.rule === 'hill-start')).toBe(false)
    const strict = workshopSettingsSchema.parse({ minStartGradePct: 60 })
    expect(runRules({ ...x, settings: strict }).some(w => w.rule === 'hill-start')).toBe(true)
  })
})
