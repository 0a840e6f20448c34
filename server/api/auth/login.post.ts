import { loginSchema } from '../../../shared/schemas/user'
import { User } from '../../models'

// One plain message for every failure, so nobody learns which part was wrong.
const REFUSED = 'That e-mail and password do not match an active account.'

export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, zodValidator(loginSchema))
  const ip = await assertSignInAllowed(event, email)
  const user = await User.scope('withPassword').findOne({ where: { email } })
  const ok = user?.active ? await verifyPassword(user.passwordHash, password) : false
  await recordSignIn(ip, email, ok)
  if (!user || !ok) throw createError({ statusCode: 401, message: REFUSED })
  const sessionUser = { id: user.id, workshopId: user.workshopId, email: user.email, name: user.name, roles: user.roles }
  await setUserSession(event, { user: sessionUser, loggedInAt: Date.now() })
  return sessionUser
})
