import type { H3Event } from 'h3'

export interface BodyLimits { maxBytes: number, maxDepth: number, maxKeys: number }

const tooBig = (limits: BodyLimits) =>
  createError({ statusCode: 413, message: `The request is larger than ${Math.round(limits.maxBytes / 1024)} KB.`, data: { maxBytes: limits.maxBytes } })

// Reads the body as it streams in and stops at the limit, whatever Content-Length said (or did not say).
async function readCapped(event: H3Event, limits: BodyLimits): Promise<string> {
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (Number.isFinite(declared) && declared > limits.maxBytes) throw tooBig(limits)
  const chunks: Buffer[] = []
  let size = 0
  for await (const chunk of event.node.req as AsyncIterable<Buffer>) {
    size += chunk.length
    if (size > limits.maxBytes) {
      event.node.req.resume() // drain the rest so the client still reads the answer
      throw tooBig(limits)
    }
    chunks.push(chunk)
  }
  return Buffer.concat(chunks).toString('utf8')
}

// How deep the value nests and how many keys and items it holds, counted without recursion.
export function jsonShape(value: unknown): { depth: number, keys: number, protoKey: boolean } {
  let depth = 0
  let keys = 0
  let protoKey = false
  const stack: [unknown, number][] = [[value, 0]]
  while (stack.length) {
    const [node, level] = stack.pop()!
    if (node === null || typeof node !== 'object') continue
    depth = Math.max(depth, level + 1)
    if (!Array.isArray(node) && Object.hasOwn(node, '__proto__')) protoKey = true
    const children = Array.isArray(node) ? node : Object.values(node)
    keys += children.length
    for (const c of children) stack.push([c, level + 1])
  }
  return { depth, keys, protoKey }
}

// A JSON body for a route that runs on every keystroke: small, shallow and few-keyed, refused otherwise
// before any validator sees it.
export async function readSmallJsonBody(event: H3Event, limits: BodyLimits): Promise<unknown> {
  const text = await readCapped(event, limits)
  let body: unknown
  try { body = JSON.parse(text) } catch {
    throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' })
  }
  const shape = jsonShape(body)
  if (shape.depth > limits.maxDepth || shape.keys > limits.maxKeys) {
    throw createError({ statusCode: 400, message: `The request body nests deeper than ${limits.maxDepth} levels or holds more than ${limits.maxKeys} values.`, data: { maxDepth: limits.maxDepth, maxKeys: limits.maxKeys } })
  }
  if (shape.protoKey) throw createError({ statusCode: 400, message: 'The request body\'s JSON holds a key named "__proto__", which is refused.' })
  return body
}
