import type { H3Event } from 'h3'
import type { Evaluation, PlatformLike } from '../../../shared/compute'
import type { EvaluateRequest } from '../../../shared/schemas/evaluate'
import type { VehicleSpec } from '../../../shared/schemas/vehicle-spec'
import { vehicleScopeSql } from '../guards/guards'
import { signedInRead } from '../guards/signed-in'
import { settingsOf, evaluateOnServer } from './evaluation'
import { requireKnownSettings } from './settings-check'
import { findWorkshopPlatform } from './platforms'

interface CarRow { spec: VehicleSpec | null, key: string | null, name: string, motorMaxRpm: number, torqueConstantNmPerA: number | null, schema: unknown, settings: Record<string, unknown> | null }

// The workshop's settings and, when asked for, the car with its own drive unit, in one plain query (the tune
// sheet calls this on every change), the car scoped as requireVehicle scopes it, in the same round trip as the
// sign-in check (guards/signed-in.ts).
async function loadCarAndSettings(event: H3Event, vehicleId: number | undefined) {
  const car = vehicleId !== undefined
  const { user, rows: [row] } = await signedInRead<CarRow>(event, u => ({
    sql: `SELECT w.settings${car ? ', v.spec, pl.key, pl.name, pl."motorMaxRpm", pl."torqueConstantNmPerA", pl.schema' : ''}
       FROM workshops w${car ? ` LEFT JOIN vehicles v ON v.id = :vehicleId AND ${vehicleScopeSql(u, 'v')}
       LEFT JOIN platforms pl ON pl.id = v."platformId"` : ''}
      WHERE w.id = :workshopId`,
    replacements: { workshopId: u.workshopId, vehicleId, userId: u.id }
  }))
  if (car && !row?.spec) throw createError({ statusCode: 404, message: 'No such car in this workshop.' })
  const platform: PlatformLike | null = row?.key ? { key: row.key, name: row.name, motorMaxRpm: row.motorMaxRpm, torqueConstantNmPerA: row.torqueConstantNmPerA, schema: row.schema } : null
  return { user, spec: row?.spec ?? null, platform, settings: settingsOf(row) }
}

// POST /api/evaluate: a stored car or a typed spec, on a drive unit of this workshop.
export async function evaluateRequest(event: H3Event, input: EvaluateRequest): Promise<Evaluation> {
  const { user, spec, platform: carPlatform, settings } = await loadCarAndSettings(event, input.vehicleId)
  // The car's own drive unit came with the car; another one is looked up.
  const platform = carPlatform?.key === input.platformKey ? carPlatform : await findWorkshopPlatform(input.platformKey, user.workshopId)
  if (!platform) {
    throw createError({ statusCode: 400, message: `Unknown drive unit "${input.platformKey}".`, data: { fields: [{ path: 'platformKey', message: 'Unknown drive unit' }] } })
  }
  requireKnownSettings(platform, input.parameters, { kinds: false })
  return evaluateOnServer(spec ?? input.spec!, platform, input.parameters, settings)
}
