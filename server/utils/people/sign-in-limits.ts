import type { H3Event } from 'h3'
import { Op } from 'sequelize'
import { LoginAttempt } from '../../models'

const WINDOW_MS = 10 * 60 * 1000
const MAX_FAILURES_PER_ADDRESS = 50
const MAX_FAILURES_PER_ACCOUNT = 8

// Repeated failed sign-ins from one address (and, sooner, against one account from one address) slow down, across every instance.
export async function assertSignInAllowed(event: H3Event, email: string) {
  const ip = getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'
  const since = new Date(Date.now() - WINDOW_MS)
  const [byIp, byEmail] = await Promise.all([
    LoginAttempt.count({ where: { ip, succeeded: false, createdAt: { [Op.gt]: since } } }),
    LoginAttempt.count({ where: { ip, email, succeeded: false, createdAt: { [Op.gt]: since } } })
  ])
  if (byIp >= MAX_FAILURES_PER_ADDRESS || byEmail >= MAX_FAILURES_PER_ACCOUNT) {
    setResponseHeader(event, 'Retry-After', Math.ceil(WINDOW_MS / 1000))
    throw createError({ statusCode: 429, message: 'Too many failed sign-ins. Please wait a few minutes and try again.' })
  }
  return ip
}

export async function recordSignIn(ip: string, email: string, succeeded: boolean) {
  await LoginAttempt.create({ ip, email, succeeded })
}
