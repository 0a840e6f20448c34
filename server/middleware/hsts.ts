import { fromTrustedProxy } from '../utils/people/proxies'

// HSTS only where the product is served over HTTPS: directly, or behind a TLS-terminating proxy that is one of
// the trusted proxies (an X-Forwarded-Proto from anyone else is ignored; docs/deployment.md).
export default defineEventHandler((event) => {
  const encrypted = Boolean((event.node.req.socket as { encrypted?: boolean }).encrypted)
  const forwarded = encrypted ? false : getRequestHeader(event, 'x-forwarded-proto') === 'https' && fromTrustedProxy(event)
  if (encrypted || forwarded) setResponseHeader(event, 'Strict-Transport-Security', 'max-age=31536000; includeSubDomains')
})
