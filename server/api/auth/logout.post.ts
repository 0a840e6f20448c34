import { Op } from 'sequelize'
import { RevokedSession } from '../../models'

// Signs out this session everywhere: the browser forgets the cookie, and any copy of it is refused from now on.
export default defineEventHandler(async (event) => {
  const session = await getUserSession(event)
  if (session.id && session.user?.id) {
    const expiresAt = new Date(Date.now() + useRuntimeConfig(event).session.maxAge! * 1000) // no copy outlives this
    await RevokedSession.upsert({ sessionId: session.id, userId: session.user.id, expiresAt })
    await RevokedSession.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } }) // rows past any session's life
  }
  await clearUserSession(event)
  return { ok: true }
})
