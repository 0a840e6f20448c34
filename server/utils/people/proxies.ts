import type { H3Event } from 'h3'
import { isTrustedPeer, trustedProxies } from './client-address'

// The configured trusted proxies (NUXT_TRUSTED_PROXIES, docs/deployment.md), parsed once per configured list.
let proxies: { list: string, trusted: ReturnType<typeof trustedProxies> } | undefined
export function trustedProxiesOf(event: H3Event) {
  const list = String(useRuntimeConfig(event).trustedProxies ?? '')
  if (proxies?.list !== list) proxies = { list, trusted: trustedProxies(list) }
  return proxies.trusted
}

// Whether the request came straight from a trusted proxy, whose X-Forwarded-* headers may then be believed.
export function fromTrustedProxy(event: H3Event): boolean {
  return isTrustedPeer(trustedProxiesOf(event), event.node.req.socket.remoteAddress)
}
