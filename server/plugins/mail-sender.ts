// Sends the outbox every couple of seconds on every instance; the database hands each message to one of them.
export default defineNitroPlugin((nitro) => {
  if (import.meta.prerender) return
  let busy = false
  const timer = setInterval(async () => {
    if (busy) return
    busy = true
    try {
      await deliverDueMail()
    } catch (e) {
      console.warn(`[voltwright] mail sender: ${(e as Error).message}`)
    } finally {
      busy = false
    }
  }, 2000)
  nitro.hooks.hook('close', () => clearInterval(timer))
})
