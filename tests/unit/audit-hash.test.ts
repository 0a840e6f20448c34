import { createHash } from 'node:crypto'
import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
// An RFC 8785 implementation from the npm registry, to check ours against (docs/history.md).
import canonicalize from 'canonicalize'
import { auditHash, auditHashBody, eventHash, hashedRecord, sha256Hex } from '../../server/utils/history/audit'
import { canonicalJson } from '../../shared/utils/canonical-json'

const event = {
  workshopId: 1, vehicleId: 7, actorId: 3, action: 'vehicle.updated', entityType: 'vehicle', entityId: '7',
  data: { patch: [{ op: 'replace', path: '/status', value: 'converting' }] }, createdAt: '2026-12-01T09:30:00.000Z', prevHash: null
}

describe('the audit chain\'s hash', () => {
  it('is SHA-256: the FIPS 180-4 example', () => {
    // FIPS 180-4, Appendix B.1 (SHA-256 of the one-block message "abc")
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
  })

  it('covers the previous hash followed by the event\'s canonical JSON, keys sorted, without id or hash', () => {
    const body = auditHashBody(event)
    expect(body).toBe('{"action":"vehicle.updated","actorId":3,"createdAt":"2026-12-01T09:30:00.000Z","data":{"patch":[{"op":"replace","path":"/status","value":"converting"}]},"entityId":"7","entityType":"vehicle","vehicleId":7,"workshopId":1}')
    const prev = 'ab'.repeat(32)
    expect(auditHash(prev, event)).toBe(createHash('sha256').update(prev + body).digest('hex'))
    expect(auditHash(null, event)).toBe(createHash('sha256').update(body).digest('hex'))
  })

  it('changes when any covered field or the link changes, and not with key order', () => {
    const base = auditHash(null, event)
    expect(auditHash('00', event)).not.toBe(base)
    expect(auditHash(null, { ...event, action: 'vehicle.created' })).not.toBe(base)
    expect(auditHash(null, { ...event, createdAt: '2026-12-01T09:30:00.001Z' })).not.toBe(base)
    expect(auditHash(null, { ...event, data: { patch: [{ value: 'converting', path: '/status', op: 'replace' }] } })).toBe(base)
    expect(auditHash(null, { ...event, createdAt: new Date('2026-12-01T09:30:00Z') as unknown as string })).toBe(base)
  })
})

// The plain definition the fast canonicalJson must agree with: sorted keys, no whitespace, undefined dropped.
function reference(value: unknown): string {
  if (value === null || typeof value !== 'object') return typeof value === 'number' && !Number.isFinite(value) ? 'null' : JSON.stringify(value ?? null)
  if (Array.isArray(value)) return `[${value.map(reference).join(',')}]`
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${reference(v)}`).join(',')}}`
}

describe('canonical JSON', () => {
  it('agrees with its plain definition on any JSON value', () => {
    fc.assert(fc.property(fc.jsonValue(), (v) => { expect(canonicalJson(v)).toBe(reference(v)) }), { numRuns: 500 })
    expect(canonicalJson({ b: 1, a: [true, null, 'x"y'], c: undefined, é: -0, Z: 1e21 })).toBe('{"Z":1e+21,"a":[true,null,"x\\"y"],"b":1,"é":0}')
  })
})

describe('the hashed body', () => {
  it('is exactly the canonical JSON of the event without id and hash', () => {
    const events = fc.record({
      workshopId: fc.integer({ min: 1 }), vehicleId: fc.option(fc.integer({ min: 1 }), { nil: null }), actorId: fc.option(fc.integer({ min: 1 }), { nil: null }),
      action: fc.string(), entityType: fc.string(), entityId: fc.string(), data: fc.dictionary(fc.string(), fc.jsonValue()),
      createdAt: fc.date({ min: new Date('2000-01-01'), max: new Date('2100-01-01'), noInvalidDate: true }).map(d => d.toISOString()), prevHash: fc.constant(null)
    })
    fc.assert(fc.property(events, (e) => {
      const { prevHash: _p, ...covered } = e
      expect(auditHashBody(e)).toBe(reference({ ...covered, createdAt: new Date(e.createdAt).toISOString() }))
    }), { numRuns: 300 })
  })
})

const formTwo = { ...event, form: 2, actor: { name: 'Dev Carrow', email: 'tuner@voltwright.test' }, prevHash: 'cd'.repeat(32) }

describe('form 2 (docs/history.md)', () => {
  it('hashes the RFC 8785 form of one record holding the previous hash and who acted, as named then', () => {
    const record = hashedRecord(formTwo)
    expect(record).toEqual({
      form: 2, prevHash: 'cd'.repeat(32), workshopId: 1, vehicleId: 7, actor: { id: 3, name: 'Dev Carrow', email: 'tuner@voltwright.test' },
      action: 'vehicle.updated', entityType: 'vehicle', entityId: '7', data: event.data, createdAt: '2026-12-01T09:30:00.000Z'
    })
    expect(canonicalize(record)).toBe('{"action":"vehicle.updated","actor":{"email":"tuner@voltwright.test","id":3,"name":"Dev Carrow"},"createdAt":"2026-12-01T09:30:00.000Z",'
      + '"data":{"patch":[{"op":"replace","path":"/status","value":"converting"}]},"entityId":"7","entityType":"vehicle","form":2,"prevHash":"' + 'cd'.repeat(32) + '","vehicleId":7,"workshopId":1}')
    expect(eventHash(formTwo)).toBe(createHash('sha256').update(canonicalize(record)!, 'utf8').digest('hex'))
  })

  it('gives the worked examples of docs/history.md', () => {
    // Hashes computed with Node's crypto straight from the texts shown in docs/history.md.
    expect(eventHash(formTwo)).toBe('b16ee0a38e7dc823502d63f59120a841e142254b9c3a088f546faab57f4261c2')
    expect(eventHash({ ...formTwo, form: 1 })).toBe('8087aa1e7baadc339b6c01aca5fded185eb42ca3f7dcbef4ee54dc421a2b05d2')
  })

  it('changes with the recorded name, the link and the form', () => {
    const base = eventHash(formTwo)
    expect(eventHash({ ...formTwo, actor: { ...formTwo.actor, name: 'Someone Else' } })).not.toBe(base)
    expect(eventHash({ ...formTwo, prevHash: null })).not.toBe(base)
    expect(eventHash({ ...formTwo, form: 1 })).toBe(auditHash(formTwo.prevHash, formTwo))
  })

  it('form 1\'s record, with the previous hash in front, gives form 1\'s hash', () => {
    const one = { ...formTwo, form: 1 }
    const record = hashedRecord(one)
    expect(Object.keys(record)).toEqual(['action', 'actorId', 'createdAt', 'data', 'entityId', 'entityType', 'vehicleId', 'workshopId'])
    expect(createHash('sha256').update(one.prevHash + canonicalize(record), 'utf8').digest('hex')).toBe(eventHash(one))
  })

  it('our canonical JSON is RFC 8785 for any JSON value (checked against the canonicalize package)', () => {
    fc.assert(fc.property(fc.jsonValue(), (v) => { expect(canonicalJson(v)).toBe(canonicalize(v)) }), { numRuns: 1000 })
    for (const n of [1e21, 1e-7, 0.1 + 0.2, -0, 5e-324, 2 ** 53 + 2, 123456789012345680000]) expect(canonicalJson({ n })).toBe(canonicalize({ n }))
  })
})

// Real events: the demo seed's 50, written in form 1 by the register before form 2 (commit f90fd11) and read back
// from its database on 3 December 2026 (tests/unit/fixtures/form-1-demo-events.json).
describe('form 1, as docs/history.md describes it, on real demo events', async () => {
  const { default: events } = await import('./fixtures/form-1-demo-events.json') as { default: (Parameters<typeof eventHash>[0] & { id: string, hash: string })[] }

  it('recomputes every hash and link from the eight documented members, with an independent RFC 8785 implementation', () => {
    expect(events).toHaveLength(50)
    const prev = new Map<number, string | null>()
    for (const e of events) {
      expect(e.prevHash, e.id).toBe(prev.get(e.workshopId) ?? null)
      const record = { action: e.action, actorId: e.actorId, createdAt: e.createdAt, data: e.data, entityId: e.entityId, entityType: e.entityType, vehicleId: e.vehicleId, workshopId: e.workshopId }
      expect(createHash('sha256').update((e.prevHash ?? '') + canonicalize(record), 'utf8').digest('hex'), `event ${e.id} ${e.action}`).toBe(e.hash)
      expect(eventHash(e)).toBe(e.hash)
      expect(hashedRecord(e)).toEqual(record)
      prev.set(e.workshopId, e.hash)
    }
    expect(new Set(events.map(e => e.action)).size).toBeGreaterThan(10)
  })
})
