import { describe, expect, it, vi } from 'vitest'
import { checkPassword } from '../../server/utils/people/password-check'
import { clientAddress, isTrustedPeer, trustedProxies } from '../../server/utils/people/client-address'
import { delaySeconds, SIGN_IN_DELAYS } from '../../server/utils/people/sign-in-delays'

describe('checkPassword hashes once whatever the account', () => {
  const tools = () => ({ verify: vi.fn(async (hash: string, password: string) => hash === `hash:${password}`), dummyHash: vi.fn(async () => 'hash:dummy-nobody-knows') })

  it.each([
    ['an unknown e-mail', null, 'guess', false, 'hash:dummy-nobody-knows'],
    ['an inactive account, even with its right password', { active: false, passwordHash: 'hash:right' }, 'right', false, 'hash:dummy-nobody-knows'],
    ['a known account and a wrong password', { active: true, passwordHash: 'hash:right' }, 'wrong', false, 'hash:right'],
    ['a known account and the right password', { active: true, passwordHash: 'hash:right' }, 'right', true, 'hash:right']
  ] as const)('%s: one verify, answer as expected', async (_case, account, password, expected, hashChecked) => {
    const t = tools()
    expect(await checkPassword(account, password, t)).toBe(expected)
    expect(t.verify).toHaveBeenCalledTimes(1)
    expect(t.verify).toHaveBeenCalledWith(hashChecked, password)
  })

  it('never lets the dummy hash in, even if someone typed its secret', async () => {
    const t = tools()
    expect(await checkPassword(null, 'dummy-nobody-knows', t)).toBe(false)
  })
})

describe('clientAddress', () => {
  const trusted = trustedProxies('127.0.0.1, 10.0.0.0/8, fd00::/8')

  it('ignores X-Forwarded-For from a peer that is not a trusted proxy', () => {
    expect(clientAddress('203.0.113.9', '198.51.100.1', trusted)).toBe('203.0.113.9')
    expect(clientAddress('203.0.113.9', undefined, trusted)).toBe('203.0.113.9')
  })

  it('reads it from the right past every trusted proxy, behind one', () => {
    expect(clientAddress('127.0.0.1', '198.51.100.1', trusted)).toBe('198.51.100.1')
    expect(clientAddress('::ffff:127.0.0.1', '198.51.100.1', trusted)).toBe('198.51.100.1')
    expect(clientAddress('127.0.0.1', '198.51.100.1, 10.1.2.3', trusted)).toBe('198.51.100.1')
    // A client may write any X-Forwarded-For of its own: the proxy appends the real address, which wins.
    expect(clientAddress('127.0.0.1', '1.1.1.1, 198.51.100.1', trusted)).toBe('198.51.100.1')
    expect(clientAddress('fd00::1', '2001:db8::7', trusted)).toBe('2001:db8::7')
  })

  it('keeps the proxy\'s own word when the header is garbled, and trusts nobody by default', () => {
    expect(clientAddress('127.0.0.1', 'not-an-address', trusted)).toBe('127.0.0.1')
    expect(clientAddress('127.0.0.1', '198.51.100.1', trustedProxies(''))).toBe('127.0.0.1')
    expect(() => trustedProxies('10.0.0.0/8, proxy.local')).toThrow(/proxy.local/)
  })

  it('believes a peer\'s forwarded headers (X-Forwarded-Proto for HSTS) only when the peer is a trusted proxy', () => {
    expect(isTrustedPeer(trusted, '::ffff:10.4.5.6')).toBe(true)
    expect(isTrustedPeer(trusted, '203.0.113.9')).toBe(false)
    expect(isTrustedPeer(trusted, undefined)).toBe(false)
    expect(isTrustedPeer(trustedProxies(''), '127.0.0.1')).toBe(false)
  })
})

describe('sign-in delays', () => {
  it('are free at first, then double, and never pass their cap', () => {
    expect(delaySeconds('pair', SIGN_IN_DELAYS.pair.free - 1)).toBe(0)
    expect(delaySeconds('pair', SIGN_IN_DELAYS.pair.free)).toBe(5)
    expect(delaySeconds('pair', SIGN_IN_DELAYS.pair.free + 1)).toBe(10)
    expect(delaySeconds('pair', 10_000)).toBe(60)
    // The real person's wait caused by someone else's failures from elsewhere is short and bounded.
    expect(delaySeconds('account', 10_000)).toBe(15)
  })
})
