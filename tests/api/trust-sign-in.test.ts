// A guesser slows down but does not lock the real person out, and behind the trusted proxy (the test stack
// trusts 127.0.0.1) the limits are kept per client address from X-Forwarded-For (docs/security.md).
import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, anonymous, unique, withDatabase } from './helpers'

const PASSWORD = 'real-password-123'
const from = (address: string) => ({ 'x-forwarded-for': address })
const login = (email: string, password: string, address: string) => anonymous.call('POST', '/api/auth/login', { email, password }, from(address))
// Moves this account's sign-in attempts back in time, as if the wait had passed (no test sleeps).
const age = (email: string, seconds: number) => withDatabase(c => c.query(`UPDATE login_attempts SET "createdAt" = "createdAt" - make_interval(secs => $2) WHERE email = $1`, [email, seconds]), true)

describe('sign-in limits', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const person = async () => {
    const email = `${unique('signer')}@voltwright.test`
    expect((await admin.call('POST', '/api/users', { email, name: 'Demelza Pascoe', roles: ['tuner'], password: PASSWORD })).status).toBe(201)
    return email
  }

  it('slows a guesser at one address after five failures, and the real person elsewhere signs in at once', async () => {
    const email = await person()
    const statuses: number[] = []
    for (let i = 0; i < 7; i++) statuses.push((await login(email, 'guess-123456', '203.0.113.7')).status)
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429])
    const refused = await login(email, 'guess-123456', '203.0.113.7')
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    expect(Number(refused.headers.get('retry-after'))).toBeLessThanOrEqual(5)
    expect((await login(email, PASSWORD, '198.51.100.20')).status).toBe(200)
  })

  it('lets the right password in at the guesser\'s own address once the short wait has passed, not ten minutes later', async () => {
    const email = await person()
    for (let i = 0; i < 8; i++) await login(email, 'guess-123456', '203.0.113.8')
    expect((await login(email, PASSWORD, '203.0.113.8')).status).toBe(429)
    await age(email, 61) // the longest wait of one address against one account is a minute
    expect((await login(email, PASSWORD, '203.0.113.8')).status).toBe(200)
  })

  it('bounds what failures from many addresses cost the real person: a wait of at most 15 seconds', async () => {
    const email = await person()
    for (let a = 1; a <= 4; a++) for (let i = 0; i < 5; i++) await login(email, 'guess-123456', `192.0.2.${a}`)
    const waiting = await login(email, PASSWORD, '198.51.100.21')
    expect(waiting.status).toBe(429)
    expect(Number(waiting.headers.get('retry-after'))).toBeLessThanOrEqual(15)
    await age(email, 16)
    expect((await login(email, PASSWORD, '198.51.100.21')).status).toBe(200)
  })

  it('records each try under the client address the trusted proxy names', async () => {
    const email = await person()
    await login(email, 'guess-123456', '198.51.100.77, 203.0.113.99')
    const rows = await withDatabase(async c => (await c.query('SELECT ip FROM login_attempts WHERE email = $1', [email])).rows)
    expect(rows).toEqual([{ ip: '203.0.113.99' }]) // the rightmost address not a trusted proxy; the client's own claim is not believed
  })
})
