// Changes are refused when a browser sends them from another site (CSRF): the Origin must be this host.
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

export default defineEventHandler((event) => {
  if (SAFE.has(event.method) || !event.path.startsWith('/api/')) return
  const origin = getRequestHeader(event, 'origin')
  if (!origin) return // not a browser: a cross-site page cannot send a request without Origin
  let originHost: string
  try { originHost = new URL(origin).host } catch { originHost = '' }
  if (originHost !== getRequestHost(event, { xForwardedHost: false })) {
    throw createError({ statusCode: 403, message: 'This change came from another site and was refused.' })
  }
})
