// Works through re-checks on every instance; the database hands each car to one of them (docs/fleet.md).
export default defineNitroPlugin((nitro) => {
  if (import.meta.prerender) return
  let busy = false
  startRulesRechecks().catch(e => console.warn(`[voltwright] rules re-check: ${(e as Error).message}`))
  const timer = setInterval(async () => {
    if (busy) return
    busy = true
    try {
      while (await runRecheckBatch() > 0) await finishRechecks()
      await finishRechecks()
    } catch (e) {
      console.warn(`[voltwright] fleet re-check: ${(e as Error).message}`)
    } finally {
      busy = false
    }
  }, 1000)
  nitro.hooks.hook('close', () => clearInterval(timer))
})
