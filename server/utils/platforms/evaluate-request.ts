import type { H3Event } from 'h3'
import type { Evaluation, PlatformLike } from '../../../shared/compute'
import type { EvaluateRequest } from '../../../shared/schemas/evaluate'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { selectRows } from '../database/db'
import { type SignedIn, requireUser, vehicleScopeSql } from '../guards/guards'
import { settingsOf, evaluateOnServer } from './evaluation'
import { requireKnownSettings } from './settings-check'
import { findWorkshopPlatform } from './platforms'

interface CarRow { spec: VehicleSpec | null, key: string | null, name: string, motorMaxRpm: number, torqueConstantNmPerA: number | null, schema: unknown, settings: Record<string, unknown> | null }

// The workshop's settings and, when asked for, the car with its own drive unit, in one plain query (the tune
// sheet calls this on every change), the car scoped as requireVehicle scopes it.
async function loadCarAndSettings(user: SignedIn, vehicleId: number | undefined) {
  const car = vehicleId !== undefined
  const [row] = await selectRows<CarRow>(
    `SELECT w.settings${car ? ', v.spec, pl.key, pl.name, pl."motorMaxRpm", pl."torqueConstantNmPerA", pl.schema' : ''}
       FROM workshops w${car ? ` LEFT JOIN vehicles v ON v.id = :vehicleId AND ${vehicleScopeSql(user, 'v')}
       LEFT JOIN platforms pl ON pl.id = v."platformId"` : ''}
      WHERE w.id = :workshopId`, { workshopId: user.workshopId, vehicleId, userId: user.id })
  if (car && !row?.spec) throw createError({ statusCode: 404, message: 'No such car in this workshop.' })
  const platform: PlatformLike | null = row?.key ? { key: row.key, name: row.name, motorMaxRpm: row.motorMaxRpm, torqueConstantNmPerA: row.torqueConstantNmPerA, schema: row.schema } : null
  return { spec: row?.spec ?? null, platform, settings: settingsOf(row) }
}

// POST /api/evaluate: a stored car or a typed spec, on a drive unit of this workshop.
export async function evaluateRequest(event: H3Event, input: EvaluateRequest): Promise<Evaluation> {
  const user = await requireUser(event)
  const { spec, platform: carPlatform, settings } = await loadCarAndSettings(user, input.vehicleId)
  // The car's own drive unit came with the car; another one is looked up.
  const platform = carPlatform?.key === input.platformKey ? carPlatform : await findWorkshopPlatform(input.platformKey, user.workshopId)
  if (!platform) {
    throw createError({ statusCode: 400, message: `Unknown drive unit "${input.platformKey}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  }
  requireKnownSettings(platform, input.parameters, { kinds: false })
  return evaluateOnServer(spec ?? input.spec!, platform, input.parameters, settings)
}
