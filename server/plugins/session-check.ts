// The page's own session read (/api/_auth/session) answers from the cookie alone; check the person and the
// session against the database there too, so a signed-out or deactivated session is not shown as signed in.
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (session, event) => {
    if (session.user) await requireUser(event)
  })
})
