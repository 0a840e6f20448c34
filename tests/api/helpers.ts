// Shared by the API tests: they run against the built server that `npm test` started, with a real PostgreSQL.
import { setup, fetch as testFetch } from '@nuxt/test-utils/e2e'
import pg from 'pg'

export const DEMO_PASSWORD = 'voltwright-demo'
export const baseUrl = process.env.VOLTWRIGHT_BASE_URL ?? 'http://localhost:3100'

export async function useRunningServer() {
  await setup({ host: baseUrl })
}

export interface Answer<T = any> { status: number, body: T, headers: Headers }

export interface Caller {
  cookie: string
  call: <T = any>(method: string, path: string, body?: unknown, headers?: Record<string, string>) => Promise<Answer<T>>
}

// To the server npm test started, or to another one at `base` (a second instance, tests/api/second-instance.ts).
async function send<T>(method: string, path: string, body: unknown, headers: Record<string, string>, base?: string): Promise<Answer<T>> {
  const init: RequestInit = {
    method,
    headers: { 'content-type': 'application/json', 'origin': base ?? baseUrl, ...headers },
    body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    redirect: 'manual'
  }
  const res = base ? await fetch(`${base}${path}`, init) : await testFetch(path, init)
  const text = await res.text()
  let parsed: unknown = text
  try { parsed = text ? JSON.parse(text) : null } catch { /* not JSON */ }
  return { status: res.status, body: parsed as T, headers: res.headers }
}

export const anonymous: Caller = { cookie: '', call: (m, p, b, h = {}) => send(m, p, b, h) }

export async function signIn(email: string, password = DEMO_PASSWORD): Promise<Caller> {
  const res = await send('POST', '/api/auth/login', { email, password }, {})
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}: ${JSON.stringify(res.body)}`)
  const cookie = (res.headers.getSetCookie?.() ?? []).map(c => c.split(';')[0]).join('; ')
  return { cookie, call: (m, p, b, h = {}) => send(m, p, b, { cookie, ...h }) }
}

// The same signed-in person (the same cookie) calling the server at `base`.
export function callerAt(base: string, cookie: string): Caller {
  return { cookie, call: (m, p, b, h = {}) => send(m, p, b, { cookie, ...h }, base) }
}

// Direct SQL for checks the API cannot show (as the application's own role, or as the superuser).
export async function withDatabase<T>(fn: (c: pg.Client) => Promise<T>, admin = false): Promise<T> {
  const url = admin ? process.env.VOLTWRIGHT_ADMIN_DATABASE_URL : process.env.DATABASE_URL
  const client = new pg.Client({ connectionString: url })
  await client.connect()
  try { return await fn(client) } finally { await client.end() }
}

export const unique = (prefix: string) => `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}`
