import { describe, it, expect } from 'vitest'
import { fetch as testFetch } from '@nuxt/test-utils/e2e'
import { useRunningServer, signIn } from './helpers'

describe('security headers and cross-site changes', async () => {
  await useRunningServer()

  it('serves pages with a content security policy, frame-ancestors and no-sniff', async () => {
    const res = await testFetch('/login')
    const csp = res.headers.get('content-security-policy') ?? ''
    expect(csp).toContain("default-src 'self'")
    expect(csp).toContain("frame-ancestors 'none'")
    expect(csp).toMatch(/script-src [^;]*'nonce-/)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-powered-by')).toBeNull()
  })

  it('sends HSTS only when served over HTTPS', async () => {
    expect((await testFetch('/login')).headers.get('strict-transport-security')).toBeNull()
    const behindTls = await testFetch('/login', { headers: { 'x-forwarded-proto': 'https' } })
    expect(behindTls.headers.get('strict-transport-security')).toMatch(/max-age=\d+/)
  })

  it('refuses a change whose Origin is another site, and allows the same change from this one', async () => {
    const admin = await signIn('admin@voltwright.test')
    const id = (await admin.call('GET', '/api/vehicles')).body.items[0].id
    const forged = await admin.call('PATCH', `/api/vehicles/${id}`, { registration: 'FORGED 1' }, { origin: 'http://evil.example' })
    expect(forged.status).toBe(403)
    const car = (await admin.call('GET', `/api/vehicles/${id}`)).body
    expect(car.registration).not.toBe('FORGED 1')
    const honest = await admin.call('PATCH', `/api/vehicles/${id}`, { registration: car.registration })
    expect(honest.status).toBe(200)
  })

  it('answers an unexpected input without a stack trace or SQL', async () => {
    const tuner = await signIn('tuner@voltwright.test')
    const res = await tuner.call('POST', '/api/vehicles', '{"broken json')
    expect(res.status).toBe(400)
    const text = JSON.stringify(res.body)
    expect(text).not.toMatch(/\bat [\w.]+ \(|SELECT |INSERT |node_modules/)
  })
})
