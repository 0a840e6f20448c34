// Settings named within one drive unit ("unit.<key>.<setting>"): the unit must be one the workshop can use and
// the setting one of its number settings; answers each with the words a screen or a CSV heading shows.
import type { SignedIn } from '../guards/guards'
import { label, settingKind, type LooseProperty } from '../../../shared/compute/setting-kinds'
import { UNIT_SETTING } from '../../../shared/schemas/fleet-search'
import { selectRows } from '../database/db'

export interface UnitSetting { unitName: string, label: string, unit: string }

export async function unitSettingsOf(user: SignedIn, fields: string[]): Promise<Map<string, UnitSetting>> {
  const wanted = [...new Set(fields)].flatMap((f) => { const m = UNIT_SETTING.exec(f); return m ? [{ field: f, key: m[1]!, setting: m[2]! }] : [] })
  const out = new Map<string, UnitSetting>()
  if (!wanted.length) return out
  const rows = await selectRows<{ key: string, name: string, schema: { properties?: Record<string, LooseProperty> }, own: boolean }>(
    `SELECT key, name, schema, "workshopId" IS NOT NULL AS own FROM platforms WHERE key = ANY(:keys) AND ("workshopId" IS NULL OR "workshopId" = :workshopId) ORDER BY own`,
    { keys: [...new Set(wanted.map(w => w.key))], workshopId: user.workshopId })
  const byKey = new Map(rows.map(r => [r.key, r])) // the workshop's own unit wins over a shared one of the same key
  for (const w of wanted) {
    const unit = byKey.get(w.key)
    const p = unit?.schema.properties?.[w.setting]
    const kind = settingKind(p)
    if (!unit || !p || !Object.hasOwn(unit.schema.properties!, w.setting) || (kind !== 'number' && kind !== 'integer')) {
      throw createError({ statusCode: 400, message: unit ? `The ${unit.name} has no number setting of that name.` : 'No drive unit of the workshop has that key.', data: { fields: [{ path: 'field', message: 'Not a searchable setting' }] } })
    }
    out.set(w.field, { unitName: unit.name, label: label(p, w.setting), unit: typeof p.unit === 'string' ? p.unit : '' })
  }
  return out
}
