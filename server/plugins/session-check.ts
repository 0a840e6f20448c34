// The page's own session read (/api/_auth/session) answers from the cookie alone; check the person and the
// session against the database there too (signed out, deactivated, password changed), and show the person as
// they are now, so a role change shows at once.
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (session, event) => {
    if (!session.user) return
    const { id, workshopId, email, name, roles } = await requireUser(event)
    session.user = { id, workshopId, email, name, roles }
  })
})
