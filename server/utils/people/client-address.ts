// The client's address for sign-in limits. Plain, so a unit test can check it (no Nitro auto-imports here).
import { BlockList, isIP } from 'node:net'

// "::ffff:10.0.0.1" is the IPv4 address 10.0.0.1 reached over IPv6: one client, one key.
export function normaliseAddress(address: string): string {
  const a = address.trim()
  return /^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(a) ? a.slice(7) : a
}

// NUXT_TRUSTED_PROXIES: addresses and CIDR ranges, comma-separated, e.g. "127.0.0.1,10.0.0.0/8,fd00::/8".
export function trustedProxies(list: string): BlockList {
  const trusted = new BlockList()
  for (const entry of list.split(',').map(s => s.trim()).filter(Boolean)) {
    const [address = '', bits] = entry.split('/')
    const family = isIP(address) === 6 ? 'ipv6' : isIP(address) === 4 ? 'ipv4' : null
    if (!family) throw new Error(`NUXT_TRUSTED_PROXIES: "${entry}" is not an address or a CIDR range`)
    if (bits === undefined) trusted.addAddress(address, family)
    else trusted.addSubnet(address, Number(bits), family)
  }
  return trusted
}

const isTrusted = (trusted: BlockList, address: string) => {
  const family = isIP(address)
  return family !== 0 && trusted.check(address, family === 6 ? 'ipv6' : 'ipv4')
}

// Whether the direct peer is one of the trusted proxies.
export const isTrustedPeer = (trusted: BlockList, peer: string | undefined) => isTrusted(trusted, normaliseAddress(peer ?? ''))

// The direct peer, unless it is a trusted proxy: then X-Forwarded-For is read from the right, past every
// trusted proxy, to the first address that is not one. Anyone else's X-Forwarded-For is ignored.
export function clientAddress(peer: string | undefined, forwardedFor: string | undefined, trusted: BlockList): string {
  let client = normaliseAddress(peer ?? '') || 'unknown'
  if (!isTrusted(trusted, client) || !forwardedFor) return client
  const hops = forwardedFor.split(',').map(normaliseAddress).reverse()
  for (const hop of hops) {
    if (!isIP(hop)) break // a garbled entry: keep the last proxy's own word
    client = hop
    if (!isTrusted(trusted, hop)) break
  }
  return client
}
