// What an audit event changed, as rows of path, before and after, read from its RFC 6902 patch.
// A patch alone does not say what a value was before; the history supplies it from, in order: the patch's
// own `test` operations, the event's `before` snapshot, or the entity's state folded from its earlier events.
import type { ChangeRow } from '../schemas/history'

export interface PatchOp { op: string, path: string, value?: unknown, from?: string }
// What the earlier events said about an entity: every value they set, by path. `known` means the fold began
// at a full snapshot (a creation's `after`), so a path it does not hold was absent rather than unrecorded.
export interface KnownState { known: boolean, state: unknown }

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x)

export function isPatch(x: unknown): x is PatchOp[] {
  return Array.isArray(x) && x.every(o => isObject(o) && typeof o.op === 'string' && typeof o.path === 'string')
}

// RFC 6901: "/a~1b/c~0d" → ["a/b", "c~d"]. (The history folds many of these: the usual path has no "~".)
export function decodePointer(path: string): string[] {
  if (path === '') return []
  const keys = path.slice(1).split('/')
  return path.includes('~') ? keys.map(s => s.replace(/~1/g, '/').replace(/~0/g, '~')) : keys
}

const encodeKey = (k: string) => (k.includes('~') || k.includes('/') ? k.replace(/~/g, '~0').replace(/\//g, '~1') : k)

export function pointerGet(doc: unknown, path: string): { found: boolean, value?: unknown } {
  let at: unknown = doc
  for (const key of decodePointer(path)) {
    if (Array.isArray(at) && /^\d+$/.test(key) && Number(key) < at.length) at = at[Number(key)]
    else if (isObject(at) && Object.hasOwn(at, key)) at = at[key]
    else return { found: false }
  }
  return { found: true, value: at }
}

const clone = <T>(x: T): T => (x === null || typeof x !== 'object' ? x : JSON.parse(JSON.stringify(x)))

// Applies a patch without failing on paths the partial state does not hold (parents are created).
// `inPlace` changes `doc` itself, for a fold that keeps only the states it copies out.
export function applyPatchLenient(doc: unknown, patch: PatchOp[], inPlace = false): unknown {
  let root: unknown = (inPlace ? doc : clone(doc)) ?? {}
  for (const op of patch) {
    if (op.op === 'test') continue
    const keys = decodePointer(op.path)
    const value = op.op === 'move' || op.op === 'copy' ? clone(pointerGet(root, op.from ?? '').value) : clone(op.value)
    if (op.op === 'move') root = removeAt(root, decodePointer(op.from ?? ''))
    if (!keys.length) { root = op.op === 'remove' ? {} : value; continue }
    root = op.op === 'remove' ? removeAt(root, keys) : setAt(root, keys, value, op.op === 'add')
  }
  return root
}

function parentOf(root: unknown, keys: string[], create: boolean): unknown {
  let at = root
  for (const key of keys.slice(0, -1)) {
    const next = Array.isArray(at) ? at[Number(key)] : isObject(at) ? at[key] : undefined
    if (next === undefined && create && (isObject(at) || Array.isArray(at))) {
      const made = {}
      if (Array.isArray(at)) at[Number(key)] = made
      else (at as Record<string, unknown>)[key] = made
      at = made
    } else at = next
  }
  return at
}

function setAt(root: unknown, keys: string[], value: unknown, insert: boolean): unknown {
  const parent = parentOf(root, keys, true)
  const last = keys[keys.length - 1]!
  if (Array.isArray(parent)) {
    const i = last === '-' ? parent.length : Number(last)
    if (insert) parent.splice(i, 0, value)
    else parent[i] = value
  } else if (isObject(parent)) parent[last] = value
  return root
}

function removeAt(root: unknown, keys: string[]): unknown {
  const parent = parentOf(root, keys, false)
  const last = keys[keys.length - 1]!
  if (Array.isArray(parent)) parent.splice(Number(last), 1)
  else if (isObject(parent)) Reflect.deleteProperty(parent, last)
  return root
}

// Every leaf of a snapshot as a pointer and its value; arrays count as one value, an empty object as one leaf.
export function flattenLeaves(value: unknown, prefix = ''): { path: string, value: unknown }[] {
  if (!isObject(value)) return [{ path: prefix, value }]
  const rows: { path: string, value: unknown }[] = []
  collectLeaves(value, prefix, rows)
  return rows.length || !prefix ? rows : [{ path: prefix, value }]
}

function collectLeaves(value: Record<string, unknown>, prefix: string, rows: { path: string, value: unknown }[]) {
  for (const k of Object.keys(value)) {
    const path = `${prefix}/${encodeKey(k)}`
    const v = value[k]
    const before = rows.length
    if (isObject(v)) collectLeaves(v, path, rows)
    if (rows.length === before) rows.push({ path, value: v })
  }
}

function beforeOf(path: string, op: string, tests: Map<string, unknown>, snapshot: unknown, fold?: KnownState): Pick<ChangeRow, 'before' | 'beforeKnown'> {
  if (tests.has(path)) return { before: tests.get(path), beforeKnown: true }
  if (op === 'add') return { before: undefined, beforeKnown: true }
  for (const source of [isObject(snapshot) ? snapshot : undefined, fold?.state]) {
    if (source === undefined) continue
    const got = pointerGet(source, path)
    if (got.found) return { before: got.value, beforeKnown: true }
  }
  return { beforeKnown: false }
}

// The rows one event's data shows; `fold` is the entity's state just before this event, when known.
export function changeRows(data: Record<string, unknown>, fold?: KnownState): ChangeRow[] {
  if (isPatch(data.patch)) {
    const tests = new Map(data.patch.filter(o => o.op === 'test').map(o => [o.path, o.value]))
    return data.patch.filter(o => o.op !== 'test').map(o => ({
      path: o.path, op: o.op,
      ...beforeOf(o.op === 'move' ? (o.from ?? o.path) : o.path, o.op, tests, data.before, fold),
      after: o.op === 'remove' ? undefined : o.op === 'move' || o.op === 'copy' ? { from: o.from } : o.value
    }))
  }
  if (isObject(data.after) && isObject(data.before)) {
    const before = new Map(flattenLeaves(data.before).map(r => [r.path, r.value]))
    const after = new Map(flattenLeaves(data.after).map(r => [r.path, r.value]))
    const paths = [...new Set([...before.keys(), ...after.keys()])]
    return paths.filter(p => JSON.stringify(before.get(p)) !== JSON.stringify(after.get(p))).map(p => ({
      path: p, op: !before.has(p) ? 'add' : !after.has(p) ? 'remove' : 'replace', before: before.get(p), after: after.get(p), beforeKnown: true
    }))
  }
  if (isObject(data.after)) return flattenLeaves(data.after).map(r => ({ path: r.path, op: 'add', after: r.value, before: undefined, beforeKnown: true }))
  return []
}

// The entity's state after this event, for the next one's "before".
// A version's creation records its settings (and, in events written since it did, its rationale) beside the
// event's other facts rather than as `after`: as a fold source, that is the version's first state.
export function foldSource(action: string, data: Record<string, unknown>): Record<string, unknown> {
  if (action !== 'version.created' || data.after !== undefined || !isObject(data.parameters)) return data
  if (Object.hasOwn(data, 'rationale')) return { after: { parameters: data.parameters, rationale: data.rationale } }
  return { patch: [{ op: 'add', path: '/parameters', value: data.parameters }] }
}

// `inPlace` reuses the state given (the caller copies out any state it keeps).
export function foldEvent(state: KnownState, data: Record<string, unknown>, inPlace = false): KnownState {
  if (isPatch(data.patch)) return { known: state.known, state: applyPatchLenient(state.state, data.patch, inPlace) }
  if (isObject(data.after)) {
    if (!state.known || !isObject(state.state)) return { known: true, state: clone(data.after) }
    return { known: true, state: applyPatchLenient(state.state, flattenLeaves(data.after).map(r => ({ op: 'add', path: r.path, value: r.value })), inPlace) }
  }
  return state
}

export const copyState = (s: KnownState): KnownState => ({ known: s.known, state: clone(s.state) })

// What else the event recorded, beside the change itself.
export function eventDetails(data: Record<string, unknown>): Record<string, unknown> {
  const { patch: _p, before: _b, after: _a, ...rest } = data
  return rest
}

// A version's creation as rows: drafted from another, the settings that differ from it (with the parent's values
// where the caller folded them); a first version, every setting it starts with.
export function creationRows(data: Record<string, unknown>, parentParameters?: Record<string, unknown>): ChangeRow[] {
  if (isPatch(data.patchFromParent)) {
    const patch = data.patchFromParent.map(o => ({ ...o, path: `/parameters${o.path}` }))
    return changeRows({ patch, ...(parentParameters ? { before: { parameters: parentParameters } } : {}) })
  }
  if (isObject(data.parameters)) return changeRows({ after: { parameters: data.parameters } })
  return changeRows(data)
}
