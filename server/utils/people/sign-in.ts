import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { User } from '../../models'
import { checkPassword } from './password-check'

// Hashed once per instance from random text that nobody knows: it matches no password.
let dummy: Promise<string> | undefined
const dummyHash = () => (dummy ??= hashPassword(randomUUID()))

// The account for this e-mail when the password is right, else null; the same work either way.
export async function findSignIn(email: string, password: string): Promise<User | null> {
  const user = await User.scope('withPassword').findOne({ where: { email } })
  const ok = await checkPassword(user, password, { verify: verifyPassword, dummyHash })
  return ok ? user : null
}

// A fresh session with a new id, whatever cookie came with the request (no session fixation), carrying the
// person's session epoch so a later password change or deactivation ends it (docs/security.md).
export async function startSession(event: H3Event, user: User) {
  const name = useRuntimeConfig(event).session.name || 'nuxt-session'
  event.context.sessions ??= Object.create(null)
  event.context.sessions![name] = { id: randomUUID(), createdAt: Date.now(), data: Object.create(null) }
  const sessionUser = { id: user.id, workshopId: user.workshopId, email: user.email, name: user.name, roles: user.roles }
  await setUserSession(event, { user: sessionUser, secure: { sessionEpoch: user.sessionEpoch }, loggedInAt: Date.now() })
  return sessionUser
}
