import { Workshop } from '../../models'
import type { SignedIn } from '../guards/guards'
import { workshopSettingsSchema, type WorkshopSettings } from '../../../shared/compute/settings'
import { jsonPatch } from '../../../shared/utils/json-patch'
import { zodFieldErrors } from '../guards/validate'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { settingsOf } from '../platforms/evaluation'
import { startRecheck } from '../fleet/recheck-start'

export interface WorkshopView { id: number, name: string, settings: WorkshopSettings }

export async function workshopView(user: SignedIn): Promise<WorkshopView> {
  const w = await Workshop.findByPk(user.workshopId)
  if (!w) throw createError({ statusCode: 404, message: 'No such workshop.' })
  return { id: w.id, name: w.name, settings: settingsOf(w) }
}

type Json = Record<string, unknown>
const isObject = (x: unknown): x is Json => x !== null && typeof x === 'object' && !Array.isArray(x)

// A change to some settings keeps the rest: nested groups (friction, units …) merge key by key.
export function mergeSettings(base: Json, change: Json): Json {
  const out: Json = { ...base }
  for (const [k, v] of Object.entries(change)) out[k] = isObject(v) && isObject(base[k]) ? mergeSettings(base[k] as Json, v) : v
  return out
}

// Names in the change that no setting has, e.g. "friction.icy", so a typo is refused rather than ignored.
export function unknownSettings(change: Json, known: Json, prefix = ''): string[] {
  return Object.entries(change).flatMap(([k, v]) => {
    if (!(k in known)) return [`${prefix}${k}`]
    return isObject(v) && isObject(known[k]) ? unknownSettings(v, known[k] as Json, `${prefix}${k}.`) : []
  })
}

export async function updateWorkshopSettings(admin: SignedIn, change: Json): Promise<WorkshopView> {
  return useDatabase().transaction(async (transaction) => {
    const w = await Workshop.findByPk(admin.workshopId, { transaction, lock: transaction.LOCK.UPDATE })
    if (!w) throw createError({ statusCode: 404, message: 'No such workshop.' })
    const before = settingsOf(w)
    const unknown = unknownSettings(change, before as unknown as Json)
    const parsed = workshopSettingsSchema.safeParse(mergeSettings(before as unknown as Json, change))
    const fields = [...unknown.map(path => ({ path, message: 'No such setting' })), ...(parsed.success ? [] : zodFieldErrors(parsed.error))]
    if (fields.length || !parsed.success) {
      throw createError({ statusCode: 400, message: `Please check: ${fields.map(f => `${f.path} (${f.message})`).join('; ')}`.slice(0, 500), data: { fields } })
    }
    const after = parsed.data
    const patch = jsonPatch(before, after)
    await w.update({ settings: after }, { transaction })
    // The settings before, beside the patch: the workshop has no creation event for the history to fold from.
    if (patch.length) {
      await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, action: 'workshop.settings-changed', entityType: 'workshop', entityId: w.id, data: { patch, before } })
      // A threshold the rules read changed: every car's on-car settings are checked again (units are only display).
      const thresholds = patch.filter(op => !op.path.startsWith('/units'))
      if (thresholds.length) await startRecheck(transaction, admin.workshopId, 'thresholds', { patch: thresholds }, admin.id)
    }
    return { id: w.id, name: w.name, settings: after }
  })
}
