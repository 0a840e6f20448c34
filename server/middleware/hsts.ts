// HSTS only where the product is served over HTTPS (directly or behind a TLS-terminating proxy).
export default defineEventHandler((event) => {
  const forwarded = getRequestHeader(event, 'x-forwarded-proto')
  const encrypted = Boolean((event.node.req.socket as { encrypted?: boolean }).encrypted)
  if (encrypted || forwarded === 'https') setResponseHeader(event, 'Strict-Transport-Security', 'max-age=31536000; includeSubDomains')
})
