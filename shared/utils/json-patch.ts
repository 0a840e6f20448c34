import { create } from 'jsondiffpatch'
import { format as formatJsonPatch, type Op } from 'jsondiffpatch/formatters/jsonpatch'

const differ = create({ objectHash: (o: object, i?: number) => String((o as { id?: unknown }).id ?? i) })

// The change from `before` to `after` as an RFC 6902 JSON Patch.
export function jsonPatch(before: unknown, after: unknown): Op[] {
  const delta = differ.diff(before, after)
  return delta ? formatJsonPatch(delta) : []
}
