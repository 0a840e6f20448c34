import { describe, it, expect } from 'vitest'
import { useRunningServer, signIn, unique, withDatabase } from './helpers'

describe('people (workshop manager)', async () => {
  await useRunningServer()
  const admin = await signIn('admin@voltwright.test')
  const tuner = await signIn('tuner@voltwright.test')
  const otherAdmin = await signIn('admin@second.voltwright.test')

  it('lists only this workshop\'s people, without password hashes', async () => {
    const res = await admin.call('GET', '/api/users')
    expect(res.status).toBe(200)
    expect(res.body.items.some((u: { email: string }) => u.email === 'tuner@voltwright.test')).toBe(true)
    expect(res.body.items.some((u: { email: string }) => u.email.endsWith('@second.voltwright.test'))).toBe(false)
    expect(JSON.stringify(res.body)).not.toContain('passwordHash')
  })

  it('is for the manager only', async () => {
    expect((await tuner.call('GET', '/api/users')).status).toBe(403)
    expect((await tuner.call('POST', '/api/users', {})).status).toBe(403)
  })

  it('adds a person with several roles who can then sign in', async () => {
    const email = `${unique('new')}@voltwright.test`
    const res = await admin.call('POST', '/api/users', { email, name: 'New Starter', roles: ['tuner', 'tester'], password: 'a-long-password-1' })
    expect(res.status).toBe(201)
    const me = await (await signIn(email, 'a-long-password-1')).call('GET', '/api/auth/me')
    expect(me.body.roles).toEqual(['tuner', 'tester'])
    const events = await withDatabase(c => c.query(`SELECT action FROM audit_events WHERE "entityType" = 'user' AND "entityId" = $1`, [String(res.body.id)]))
    expect(events.rows.map(r => r.action)).toEqual(['user.created'])
  })

  it('refuses passwords under 12 characters and a duplicate e-mail', async () => {
    const short = await admin.call('POST', '/api/users', { email: `${unique('s')}@voltwright.test`, name: 'S', roles: ['tuner'], password: 'short' })
    expect(short.status).toBe(400)
    expect(short.body.data.fields[0].path).toBe('password')
    const dup = await admin.call('POST', '/api/users', { email: 'tuner@voltwright.test', name: 'Again', roles: ['tuner'], password: 'a-long-password-1' })
    expect(dup.status).toBe(409)
  })

  it('deactivates a person, whose session then stops working', async () => {
    const email = `${unique('leaver')}@voltwright.test`
    const created = (await admin.call('POST', '/api/users', { email, name: 'Leaver', roles: ['tester'], password: 'a-long-password-1' })).body
    const leaver = await signIn(email, 'a-long-password-1')
    expect((await leaver.call('GET', '/api/vehicles')).status).toBe(200)
    expect((await admin.call('PATCH', `/api/users/${created.id}`, { active: false })).status).toBe(200)
    expect((await leaver.call('GET', '/api/vehicles')).status).toBe(401)
  })

  it('will not let a manager lock themselves out, nor touch another workshop\'s people', async () => {
    const me = (await admin.call('GET', '/api/auth/me')).body
    expect((await admin.call('PATCH', `/api/users/${me.id}`, { active: false })).status).toBe(409)
    expect((await otherAdmin.call('PATCH', `/api/users/${me.id}`, { name: 'Taken over' })).status).toBe(404)
  })
})
