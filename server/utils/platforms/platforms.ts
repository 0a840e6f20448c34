import { Op, type Transaction } from 'sequelize'
import { Platform, Workshop } from '../../models'
import type { SignedIn } from '../guards/guards'
import { validatePlatform } from '../../../shared/platforms/ajv'
import type { PlatformUpload } from '../../../shared/schemas/platform'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'

export interface PlatformView { id: number, key: string, name: string, motorMaxRpm: number, torqueConstantNmPerA: number | null, schema: Record<string, unknown>, shared: boolean }

export function platformView(p: Platform): PlatformView {
  return { id: p.id, key: p.key, name: p.name, motorMaxRpm: p.motorMaxRpm, torqueConstantNmPerA: p.torqueConstantNmPerA ?? null, schema: p.schema, shared: p.workshopId === null }
}

// Voltwright's own drive units are shared by every workshop; an uploaded one belongs to its workshop.
export async function findWorkshopPlatform(key: string, workshopId: number, transaction?: Transaction): Promise<Platform | null> {
  return Platform.findOne({ where: { key, [Op.or]: [{ workshopId: null }, { workshopId }] }, transaction })
}

export async function createPlatform(admin: SignedIn, input: PlatformUpload): Promise<PlatformView> {
  const check = validatePlatform(input)
  if (!check.ok) {
    throw createError({ statusCode: 400, message: `The drive unit's schema cannot be used: ${check.errors.join('; ')}`.slice(0, 1000), data: { problems: check.errors, refused: check.refused ?? [], fields: [{ path: 'schema', message: check.errors[0] }] } })
  }
  return useDatabase().transaction(async (transaction) => {
    // Unique among the shared units and this workshop's own (migration 0009); another workshop's keys are its own business.
    // The lock makes two admins of one workshop adding the same key at once take turns.
    await Workshop.findByPk(admin.workshopId, { transaction, lock: transaction.LOCK.UPDATE })
    if (await findWorkshopPlatform(input.key, admin.workshopId, transaction)) {
      throw createError({ statusCode: 409, message: `A drive unit with the key "${input.key}" already exists; choose another key.`, data: { fields: [{ path: 'key', message: 'Already used' }] } })
    }
    const p = await Platform.create({ workshopId: admin.workshopId, key: input.key, name: input.name, motorMaxRpm: input.motorMaxRpm, torqueConstantNmPerA: input.torqueConstantNmPerA ?? null, schema: input.schema }, { transaction })
    await appendAuditEvent(transaction, { workshopId: admin.workshopId, actorId: admin.id, action: 'platform.created', entityType: 'platform', entityId: p.id, data: { after: { key: p.key, name: p.name, motorMaxRpm: p.motorMaxRpm, torqueConstantNmPerA: p.torqueConstantNmPerA, schema: p.schema } } })
    return platformView(p)
  })
}
