// A profile in the owner's words: "power limited to 85 kW (114 hp), gentle lift-off regen, creep off".
import { schemaProperties } from '../compute/parameter-input'
import { roleValues } from '../compute/roles'
import { settingKind } from '../compute/setting-kinds'
import { kwToHp, kphToMph } from '../compute/units'
import { settingLabel, settingValueWords } from './setting-words'

// Lift-off deceleration bands from UN Regulation No. 13-H para 5.2.22.4: at or below 0.7 m/s² regen on
// lift-off must not light the stop lamps, above 1.3 m/s² it must.
export const GENTLE_REGEN_MAX_MS2 = 0.7
export const STRONG_REGEN_MIN_MS2 = 1.3

const round = (x: number) => Math.round(x)
const oneDecimal = (x: number) => String(Math.round(x * 10) / 10)

export interface PlainFigures { liftOffDecelMs2?: number | null }

function liftOffWords(p: Record<string, number | undefined>, figures: PlainFigures): string | null {
  if (p.liftOffRegenPct === undefined) return null
  if (p.liftOffRegenPct === 0 || p.regenTorqueLimitNm === 0) return 'no lift-off regen'
  const decel = figures.liftOffDecelMs2
  if (typeof decel === 'number' && Number.isFinite(decel)) {
    if (decel <= GENTLE_REGEN_MAX_MS2) return 'gentle lift-off regen'
    if (decel <= STRONG_REGEN_MIN_MS2) return 'moderate lift-off regen'
    return 'strong lift-off regen (the brake lights come on)'
  }
  // Without the car's figures, the share of the regen limit is the best guide there is.
  return p.liftOffRegenPct <= 20 ? 'gentle lift-off regen' : p.liftOffRegenPct <= 50 ? 'moderate lift-off regen' : 'strong lift-off regen'
}

export function describeProfile(parameters: Record<string, number | undefined>, figures: PlainFigures = {}): string[] {
  const p = parameters
  const words: string[] = []
  if (p.powerCapKw !== undefined) words.push(`power limited to ${round(p.powerCapKw)} kW (${round(kwToHp(p.powerCapKw))} hp)`)
  if (p.speedLimitKph !== undefined) words.push(`top speed limited to ${round(p.speedLimitKph)} km/h (${round(kphToMph(p.speedLimitKph))} mph)`)
  const liftOff = liftOffWords(p, figures)
  if (liftOff) words.push(liftOff)
  if (p.brakeRegenPct !== undefined) words.push(p.brakeRegenPct === 0 || p.regenTorqueLimitNm === 0 ? 'no regen on the brake pedal' : 'regen on the brake pedal')
  if (p.creepTorqueNm !== undefined) {
    words.push(p.creepTorqueNm === 0 || p.creepSpeedKph === 0 ? 'creep off' : `creeps like an automatic, up to ${oneDecimal(p.creepSpeedKph ?? 0)} km/h`)
  }
  return words
}

export function describeProfileSentence(parameters: Record<string, number | undefined>, figures: PlainFigures = {}): string {
  const text = describeProfile(parameters, figures).join(', ')
  return text ? `${text[0]!.toUpperCase()}${text.slice(1)}.` : ''
}

// Any drive unit's settings: the roles read in their own units, then its switches and modes by their titles.
export function describeSettings(schema: unknown, parameters: Record<string, unknown>, figures: PlainFigures = {}, torqueConstantNmPerA?: number | null): string[] {
  const roles = roleValues(schema, parameters, { torqueConstantNmPerA })
  const known = Object.fromEntries(Object.entries(roles.values).filter(([, v]) => v !== null)) as Record<string, number>
  const extra = Object.entries(schemaProperties(schema)).flatMap(([name, p]) => {
    const kind = settingKind(p)
    if ((kind !== 'boolean' && kind !== 'enumeration') || parameters[name] === undefined) return []
    const title = settingLabel(p, name).toLowerCase()
    return [kind === 'boolean' ? `${title} ${parameters[name] ? 'on' : 'off'}` : `${title}: ${settingValueWords(p, parameters[name]).toLowerCase()}`]
  })
  return [...describeProfile(known, figures), ...extra]
}
