import { loginSchema } from '../../../shared/schemas/user'

// One plain message for every failure, so nobody learns which part was wrong.
const REFUSED = 'That e-mail and password do not match an active account.'

export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, zodValidator(loginSchema))
  const client = await assertSignInAllowed(event, email)
  const user = await findSignIn(email, password)
  await recordSignIn(client, email, user !== null)
  if (!user) throw createError({ statusCode: 401, message: REFUSED })
  return startSession(event, user)
})
