// Every couple of seconds on every instance: claims the day's mail of each workshop's history head (once per
// workshop and day, whichever instance gets there first; docs/history.md), then sends the outbox; the
// database hands each message to one instance.
export default defineNitroPlugin((nitro) => {
  if (import.meta.prerender) return
  let busy = false
  const timer = setInterval(async () => {
    if (busy) return
    busy = true
    try {
      await sendDailyHeadMails()
    } catch (e) {
      console.warn(`[voltwright] daily history head mail: ${(e as Error).message}`)
    }
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
