import { parseCookies, unsealSession, type SessionConfig } from 'h3'

// Opening the sealed session cookie costs about half a millisecond of crypto, on every request. The same
// sealed text always opens to the same session, so each instance keeps the ones it opened lately and hands
// h3 a copy. A cache any instance rebuilds on its own: nothing here is state another instance needs.
const KEPT = 5000
interface Opened { id: string, createdAt: number, data: Record<string, unknown> }
const opened = new Map<string, Opened>()

// As nuxt-auth-utils builds it: the runtime config's session with the password from the environment. Set once.
let built: SessionConfig | undefined
function sessionConfig(): SessionConfig {
  if (!built) {
    const session = useRuntimeConfig().session as unknown as SessionConfig
    built = { ...session, password: process.env.NUXT_SESSION_PASSWORD || session.password }
  }
  return built
}

export default defineEventHandler(async (event) => {
  const config = sessionConfig()
  const name = config.name!
  const sealed = parseCookies(event)[name]
  if (!sealed || getRequestHeader(event, `x-${name}-session`)) return // h3 opens it, and refuses it, as usual
  let session = opened.get(sealed)
  if (session && config.maxAge && Date.now() - session.createdAt > config.maxAge * 1000) {
    opened.delete(sealed)
    return
  }
  if (!session) {
    const unsealed = await unsealSession(event, config, sealed).catch(() => null)
    if (!unsealed?.id) return
    session = { id: unsealed.id, createdAt: unsealed.createdAt ?? 0, data: (unsealed.data ?? {}) as Record<string, unknown> }
    if (opened.size >= KEPT) opened.delete(opened.keys().next().value!)
    opened.set(sealed, session)
  }
  event.context.sessions ??= Object.create(null)
  event.context.sessions![name] = { id: session.id, createdAt: session.createdAt, data: structuredClone(session.data) }
})
