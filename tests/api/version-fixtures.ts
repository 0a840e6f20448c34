// Cars and profiles of their own for the version tests, so the demo data stays as seeded.
import { createHash } from 'node:crypto'
import { expect } from 'vitest'
import { RULE_IDS } from '../../shared/compute/types'
import { unique, type Caller } from './helpers'

// A light rear-driven saloon on the Fenlow 45 (the vehicles test's car).
export const testSpec = {
  kerbMassKg: 1050, frontAxleLoadPct: 50, wheelbaseMm: 2400, cgHeightMm: 500, tyreSize: '165/80 R15 86S',
  finalDriveRatio: 7.5, drivetrainEfficiency: 0.9, dragCoefficient: 0.42, frontalAreaM2: 1.8, rollingResistanceCoeff: 0.01,
  drivenAxle: 'rear', originalEnginePowerKw: 55, packNominalVoltageV: 350, packCapacityKwh: 30,
  packMaxChargeCurrentA: 100, packMaxDischargeCurrentA: 300, chargerPowerKw: 7
}

// Strong lift-off regen on a rear-driven car: beyond the rear axle's grip on snow (a danger warning).
export const strongRegen = { regenTorqueLimitNm: 120, liftOffRegenPct: 70 }

export async function newCar(tuner: Caller, platformKey = 'fenlow-45') {
  const res = await tuner.call('POST', '/api/vehicles', { stockRef: unique('V').slice(0, 20), make: 'Testwick', model: 'Review Saloon', year: 1964, platformKey, spec: testSpec })
  expect(res.status).toBe(201)
  return res.body as { id: number, stockRef: string }
}

export async function newProfile(tuner: Caller, vehicleId: number, body: Record<string, unknown> = {}) {
  const res = await tuner.call('POST', `/api/vehicles/${vehicleId}/profiles`, { name: unique('Road'), ...body })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body
}

export async function platformSchema(caller: Caller, key = 'fenlow-45') {
  const platforms = (await caller.call('GET', '/api/platforms')).body.items as { key: string, schema: { properties: Record<string, { default: number, minimum: number, maximum: number, unit: string, title: string }> } }[]
  return platforms.find(p => p.key === key)!.schema
}

// Written here from docs/architecture.md#version-hash rather than taken from the app: keys sorted at every level, no whitespace.
function sortedJson(x: unknown): string {
  if (x === null || typeof x !== 'object') return JSON.stringify(x)
  if (Array.isArray(x)) return `[${x.map(sortedJson).join(',')}]`
  return `{${Object.keys(x).sort().map(k => `${JSON.stringify(k)}:${sortedJson((x as Record<string, unknown>)[k])}`).join(',')}}`
}

export function expectedContentHash(v: { profileId: number, versionNo: number, parentVersionId: number | null, parameters: unknown, rationale: string, author: { id: number }, origin: string }) {
  const content = { profileId: v.profileId, versionNo: v.versionNo, parentVersionId: v.parentVersionId, parameters: v.parameters, rationale: v.rationale, authorId: v.author.id, origin: v.origin }
  return createHash('sha256').update(sortedJson(content)).digest('hex')
}

export const paths = (body: { data?: { fields?: { path: string }[] } }) => (body.data?.fields ?? []).map(f => f.path).sort()

// Sends a version to review with every safety rule justified, and (unless told not to) has another engineer approve it.
export const allJustified = (text = 'Checked on this car by the workshop; see the road test.') => Object.fromEntries(RULE_IDS.map(rule => [rule, text]))

export async function submitAndApprove(author: Caller, reviewer: Caller | null, versionId: number) {
  const justifications = allJustified()
  const submitted = await author.call('POST', `/api/versions/${versionId}/submit`, { justifications })
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(200)
  if (!reviewer) return
  const approved = await reviewer.call('POST', `/api/versions/${versionId}/approve`, { comment: 'Fine' })
  expect(approved.status, JSON.stringify(approved.body)).toBe(200)
}
