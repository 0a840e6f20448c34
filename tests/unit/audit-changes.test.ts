import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import jsonpatch from 'fast-json-patch'
import { applyPatchLenient, changeRows, copyState, foldSource, decodePointer, flattenLeaves, foldEvent, pointerGet, type KnownState, type PatchOp } from '../../shared/utils/audit-changes'
import { jsonPatch } from '../../shared/utils/json-patch'

describe('what an audit event changed', () => {
  it('decodes JSON pointers as RFC 6901 says', () => {
    // RFC 6901 section 5 examples: "/a~1b" is the key "a/b", "/m~0n" is "m~n"
    expect(decodePointer('/a~1b')).toEqual(['a/b'])
    expect(decodePointer('/m~0n')).toEqual(['m~n'])
    expect(decodePointer('')).toEqual([])
    expect(pointerGet({ 'a/b': 1, 'c': [5, 6] }, '/c/1')).toEqual({ found: true, value: 6 })
    expect(pointerGet({ a: 1 }, '/b')).toEqual({ found: false })
  })

  it('applies a patch as an independent RFC 6902 library does', () => {
    const value = fc.dictionary(fc.constantFrom('powerCapKw', 'status', 'spec', 'roles', 'a/b'), fc.oneof(fc.integer(), fc.string({ maxLength: 4 }), fc.array(fc.integer(), { maxLength: 3 }), fc.dictionary(fc.constantFrom('x', 'y'), fc.integer())))
    fc.assert(fc.property(value, value, (before, after) => {
      const patch = jsonPatch(before, after) as PatchOp[]
      const independent = jsonpatch.applyPatch(structuredClone(before), patch as never, false, false).newDocument
      expect(applyPatchLenient(before, patch)).toEqual(independent)
      expect(independent).toEqual(after)
    }), { numRuns: 300 })
  })

  it('takes "before" from test operations, then the event\'s before snapshot, then the folded state', () => {
    const patch = [{ op: 'test', path: '/powerCapKw', value: 40 }, { op: 'replace', path: '/powerCapKw', value: 45 }]
    expect(changeRows({ patch })).toEqual([{ path: '/powerCapKw', op: 'replace', before: 40, after: 45, beforeKnown: true }])
    expect(changeRows({ patch: [{ op: 'replace', path: '/driftedAt', value: null }], before: { driftedAt: 'x' } })[0]).toMatchObject({ before: 'x', beforeKnown: true })
    const fold = { known: true, state: { status: 'intake' } }
    expect(changeRows({ patch: [{ op: 'replace', path: '/status', value: 'converting' }] }, fold)[0]).toMatchObject({ before: 'intake', after: 'converting' })
    expect(changeRows({ patch: [{ op: 'replace', path: '/status', value: 'converting' }] })[0]).toMatchObject({ beforeKnown: false })
    expect(changeRows({ patch: [{ op: 'remove', path: '/status' }] }, fold)[0]).toMatchObject({ op: 'remove', before: 'intake', after: undefined })
  })

  it('folds an entity\'s events so each change knows the value it replaced', () => {
    let state = foldEvent({ known: false, state: undefined }, { after: { status: 'intake', spec: { kerbMassKg: 1050 } } })
    const rows: unknown[] = []
    for (const patch of [[{ op: 'replace', path: '/spec/kerbMassKg', value: 1075 }], [{ op: 'replace', path: '/spec/kerbMassKg', value: 1090 }]]) {
      rows.push(...changeRows({ patch }, state))
      state = foldEvent(state, { patch })
    }
    expect(rows).toEqual([
      { path: '/spec/kerbMassKg', op: 'replace', before: 1050, after: 1075, beforeKnown: true },
      { path: '/spec/kerbMassKg', op: 'replace', before: 1075, after: 1090, beforeKnown: true }
    ])
  })

  it('folds in place to the same states as folding copies, and leaves the events as they were', () => {
    // Random successive snapshots of one entity, each event an RFC 6902 patch from the last (or a full snapshot).
    const value = fc.dictionary(fc.constantFrom('powerCapKw', 'status', 'spec', 'a/b'), fc.oneof(fc.integer(), fc.string({ maxLength: 3 }), fc.dictionary(fc.constantFrom('x', 'y'), fc.integer())))
    fc.assert(fc.property(fc.array(value, { minLength: 1, maxLength: 8 }), fc.boolean(), (snapshots, startWithSnapshot) => {
      const events = snapshots.map((after, i) => i === 0 && startWithSnapshot ? { after } : { patch: jsonPatch(i ? snapshots[i - 1] : {}, after) as unknown })
      const untouched = structuredClone(events)
      let copying: KnownState = { known: false, state: undefined }
      let inPlace: KnownState = { known: false, state: undefined }
      const kept: KnownState[] = []
      const expected: KnownState[] = []
      for (const e of events) {
        copying = foldEvent(copying, e)
        inPlace = foldEvent(inPlace, e, true)
        kept.push(copyState(inPlace))
        expected.push(copying)
      }
      expect(kept).toEqual(expected) // a copy taken early is not changed by the folding after it
      expect(events).toEqual(untouched)
    }), { numRuns: 300 })
  })

  it('takes a version\'s creation as its first state: whole when it names the rationale, the settings alone when not', () => {
    const whole = foldEvent({ known: false, state: undefined }, foldSource('version.created', { versionNo: 1, parameters: { powerCapKw: 40 }, rationale: 'First cut' }))
    expect(whole).toEqual({ known: true, state: { parameters: { powerCapKw: 40 }, rationale: 'First cut' } })
    const older = foldEvent({ known: false, state: undefined }, foldSource('version.created', { versionNo: 1, parameters: { powerCapKw: 40 } }))
    expect(older).toEqual({ known: false, state: { parameters: { powerCapKw: 40 } } })
    expect(changeRows({ patch: [{ op: 'replace', path: '/rationale', value: 'x' }] }, older)[0]).toMatchObject({ beforeKnown: false })
    expect(foldSource('vehicle.updated', { parameters: { a: 1 } })).toEqual({ parameters: { a: 1 } })
  })

  it('knows a value\'s last writer even without a snapshot to start from', () => {
    let state = foldEvent({ known: false, state: undefined }, { patch: [{ op: 'replace', path: '/registration', value: 'KP 1' }] })
    expect(changeRows({ patch: [{ op: 'replace', path: '/registration', value: 'KP 2' }] }, state)[0]).toMatchObject({ before: 'KP 1', beforeKnown: true })
    expect(changeRows({ patch: [{ op: 'replace', path: '/status', value: 'intake' }] }, state)[0]).toMatchObject({ beforeKnown: false })
    state = foldEvent(state, { patch: [{ op: 'remove', path: '/registration' }] })
    expect(changeRows({ patch: [{ op: 'replace', path: '/registration', value: 'KP 3' }] }, state)[0]).toMatchObject({ beforeKnown: false })
  })

  it('shows a creation as every field added, and a before/after pair as what differs', () => {
    expect(flattenLeaves({ a: 1, b: { c: 2 }, d: [1, 2] })).toEqual([{ path: '/a', value: 1 }, { path: '/b/c', value: 2 }, { path: '/d', value: [1, 2] }])
    expect(changeRows({ after: { make: 'Testwick' } })).toEqual([{ path: '/make', op: 'add', before: undefined, after: 'Testwick', beforeKnown: true }])
    expect(changeRows({ before: { a: 1, b: 2 }, after: { a: 1, b: 3 } })).toEqual([{ path: '/b', op: 'replace', before: 2, after: 3, beforeKnown: true }])
  })
})
