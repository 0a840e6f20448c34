// Kits of their own for the kit tests, so the demo kits stay as seeded.
import { expect } from 'vitest'
import { unique, type Caller } from './helpers'
import { testSpec } from './version-fixtures'

// A modest baseline on the Fenlow 45 for a light rear-driven car: no danger warnings on the test spec.
export const baselineSettings = { powerCapKw: 40, torqueCapNm: 150, regenTorqueLimitNm: 80, liftOffRegenPct: 20, speedLimitKph: 120 }

export async function newKit(caller: Caller, body: Record<string, unknown> = {}) {
  const res = await caller.call('POST', '/api/kits', {
    name: unique('Kit'), platformKey: 'fenlow-45', specTemplate: testSpec, parameters: baselineSettings,
    fits: [{ make: 'Testwick', model: 'Review Saloon', yearFrom: 1960, yearTo: 1968 }], ...body
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number, name: string, baselineProfileId: number, versions: { id: number, versionNo: number, state: string }[] }
}

export async function bookIn(caller: Caller, kitId: number, body: Record<string, unknown> = {}) {
  return caller.call('POST', '/api/vehicles', { kitId, stockRef: unique('K').slice(0, 20), make: 'Testwick', model: 'Review Saloon', year: 1964, ...body })
}

export async function carProfile(caller: Caller, vehicleId: number) {
  const res = await caller.call('GET', `/api/vehicles/${vehicleId}/profiles`)
  expect(res.status).toBe(200)
  return res.body.items[0]
}
