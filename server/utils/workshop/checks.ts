// The workshop's own road-test checks: listed, added, changed or retired (never deleted), each with its
// audit event; and the ones that apply to a car's drive unit (docs/road-tests.md).
import type { Transaction } from 'sequelize'
import { Workshop, WorkshopCheck } from '../../models'
import type { SignedIn } from '../guards/guards'
import { useDatabase } from '../database/db'
import { findWorkshopPlatform } from '../platforms/platforms'
import { appendAuditEvent } from '../history/audit'
import { mandatoryCheckKeys } from '../../../shared/schemas/road-test'
import { keyFromLabel, type RecordedCheck, type WorkshopCheck as CheckView, type WorkshopCheckCreate, type WorkshopCheckPatch } from '../../../shared/schemas/workshop-checks'

export const MAX_CHECKS = 60

export function checkView(c: WorkshopCheck): CheckView {
  return { key: c.key, label: c.label, record: c.record, unit: c.unit ?? null, min: c.min ?? null, max: c.max ?? null, required: c.required, platformKeys: c.platformKeys ?? null, retired: c.retiredAt !== null && c.retiredAt !== undefined }
}

export const recordedCheck = ({ retired: _r, platformKeys: _p, ...c }: CheckView): RecordedCheck => c

export async function listChecks(workshopId: number): Promise<CheckView[]> {
  return (await WorkshopCheck.findAll({ where: { workshopId }, order: [['id', 'ASC']] })).map(checkView)
}

// The checks in force for a car on this drive unit, in the order they were added.
export async function checksFor(workshopId: number, platformKey: string | null): Promise<CheckView[]> {
  const rows = await WorkshopCheck.findAll({ where: { workshopId, retiredAt: null }, order: [['id', 'ASC']] })
  return rows.map(checkView).filter(c => c.platformKeys === null || (platformKey !== null && c.platformKeys.includes(platformKey)))
}

export async function createCheck(admin: SignedIn, input: WorkshopCheckCreate): Promise<CheckView> {
  return useDatabase().transaction(async (transaction) => {
    // One admin at a time per workshop, so two new checks with one label get two keys.
    await Workshop.findByPk(admin.workshopId, { transaction, lock: transaction.LOCK.UPDATE })
    const taken = new Set((await WorkshopCheck.findAll({ where: { workshopId: admin.workshopId }, attributes: ['key'], transaction })).map(c => c.key))
    if (taken.size >= MAX_CHECKS) throw createError({ statusCode: 409, message: `A workshop keeps at most ${MAX_CHECKS} checks; retire or change one instead.` })
    // The six drive checks' keys stay theirs, so "Hill start" as the workshop's own check becomes hill-start-2.
    await requireKnownUnits(admin.workshopId, input.platformKeys ?? null, transaction)
    const base = keyFromLabel(input.label)
    let key = base
    for (let i = 2; taken.has(key) || (mandatoryCheckKeys as readonly string[]).includes(key); i++) key = `${base}-${i}`
    const c = await WorkshopCheck.create({
      workshopId: admin.workshopId, key, label: input.label, record: input.record, unit: input.unit ?? null, min: input.min ?? null, max: input.max ?? null,
      required: input.required, platformKeys: input.platformKeys ?? null
    }, { transaction })
    const after = checkView(c)
    await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, action: 'workshop-check.created', entityType: 'workshop-check', entityId: c.id, data: { after } })
    return after
  })
}

export async function changeCheck(admin: SignedIn, key: string, input: WorkshopCheckPatch): Promise<CheckView> {
  return useDatabase().transaction(async (transaction) => {
    const c = await WorkshopCheck.findOne({ where: { workshopId: admin.workshopId, key }, transaction, lock: transaction.LOCK.UPDATE })
    if (!c) throw createError({ statusCode: 404, message: 'No such check in this workshop.' })
    const before = checkView(c)
    const { retired, ...fields } = input
    const next = { ...before, ...fields, ...(retired === undefined ? {} : { retired }) }
    refuseChange(before, next, retired)
    if (same(before, next)) return before
    await requireKnownUnits(admin.workshopId, fields.platformKeys ?? null, transaction)
    await c.update({ ...fields, ...(retired === undefined ? {} : { retiredAt: retired ? (c.retiredAt ?? new Date()) : null }) }, { transaction })
    const after = checkView(c)
    await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, action: 'workshop-check.changed', entityType: 'workshop-check', entityId: c.id, data: { before, after } })
    return after
  })
}

// What a change may not do: set a range backwards (the stored bound counts when only one is sent), give a
// pass/fail check a unit or a range, or change a retired check without bringing it back in the same change.
function refuseChange(before: CheckView, next: CheckView, retired: boolean | undefined) {
  const refuse = (message: string, path: string, field: string) => { throw createError({ statusCode: 400, message, data: { fields: [{ path, message: field }] } }) }
  if (before.retired && retired !== false && !same(before, next)) refuse('This check is retired: bring it back before changing it.', 'retired', 'Retired')
  if (next.min !== null && next.max !== null && next.min >= next.max) refuse('The highest expected value must be above the lowest.', 'max', 'Must be above the lowest')
  if (before.record === 'pass-fail' && (next.unit !== null || next.min !== null || next.max !== null)) refuse('A pass/fail check has no unit or expected range.', 'unit', 'Only a number check has a unit')
}

const same = (a: CheckView, b: CheckView) => JSON.stringify(a) === JSON.stringify(b)

// Every drive unit named must be one this workshop can fit (its own or a shared one).
async function requireKnownUnits(workshopId: number, keys: string[] | null, transaction: Transaction) {
  for (const key of keys ?? []) {
    if (!await findWorkshopPlatform(key, workshopId, transaction)) {
      throw createError({ statusCode: 400, message: `There is no drive unit "${key}" in this workshop.`, data: { fields: [{ path: 'platformKeys', message: 'Choose drive units from the list' }] } })
    }
  }
}
