import type { H3Event } from 'h3'
import { QueryTypes } from 'sequelize'
import { LoginAttempt } from '../../models'
import { useDatabase } from '../database/db'
import { clientAddress } from './client-address'
import { trustedProxiesOf } from './proxies'
import { delaySeconds, SIGN_IN_DELAYS, type Scope } from './sign-in-delays'

// Waits between failed sign-ins in ./sign-in-delays; kept in PostgreSQL, so every instance sees the same.
const WINDOW_MS = 15 * 60 * 1000

export function signInClient(event: H3Event): string {
  return clientAddress(event.node.req.socket.remoteAddress, getRequestHeader(event, 'x-forwarded-for'), trustedProxiesOf(event)).slice(0, 64)
}

type Row = Record<`${Scope}_n`, number> & Record<`${Scope}_last`, Date | null>

// Answers 429 with Retry-After while a wait is running; otherwise the client address to record the try under.
export async function assertSignInAllowed(event: H3Event, email: string): Promise<string> {
  const ip = signInClient(event)
  const pair = `ip = :ip AND email = :email AND NOT succeeded AND "createdAt" > coalesce((SELECT max("createdAt") FROM recent WHERE ip = :ip AND email = :email AND succeeded), '-infinity')`
  const account = `email = :email AND NOT succeeded AND "createdAt" > coalesce((SELECT max("createdAt") FROM recent WHERE email = :email AND succeeded), '-infinity')`
  const address = 'ip = :ip AND NOT succeeded'
  const [row] = await useDatabase().query<Row>(
    `WITH recent AS (SELECT ip, email, succeeded, "createdAt" FROM login_attempts WHERE "createdAt" > :since AND (ip = :ip OR email = :email))
     SELECT count(*) FILTER (WHERE ${pair})::int AS pair_n, max("createdAt") FILTER (WHERE ${pair}) AS pair_last,
            count(*) FILTER (WHERE ${account})::int AS account_n, max("createdAt") FILTER (WHERE ${account}) AS account_last,
            count(*) FILTER (WHERE ${address})::int AS address_n, max("createdAt") FILTER (WHERE ${address}) AS address_last
       FROM recent`,
    { replacements: { ip, email, since: new Date(Date.now() - WINDOW_MS) }, type: QueryTypes.SELECT })
  const waitMs = Math.max(0, ...(Object.keys(SIGN_IN_DELAYS) as Scope[]).map((s) => {
    const last = row?.[`${s}_last`]
    return last ? new Date(last).getTime() + delaySeconds(s, row[`${s}_n`]) * 1000 - Date.now() : 0
  }))
  if (waitMs > 0) {
    const seconds = Math.ceil(waitMs / 1000)
    setResponseHeader(event, 'Retry-After', seconds)
    throw createError({ statusCode: 429, message: `Too many failed sign-ins. Please wait ${seconds} seconds and try again.`, data: { retryAfterSeconds: seconds } })
  }
  return ip
}

export async function recordSignIn(ip: string, email: string, succeeded: boolean) {
  await LoginAttempt.create({ ip, email, succeeded })
}
