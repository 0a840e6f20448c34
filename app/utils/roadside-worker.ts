// The service worker that keeps the road-test wizard's page and code on the phone (public/roadside-sw.js,
// docs/road-tests.md#no-signal).
export const ROADSIDE_CACHE = 'voltwright-roadside-v1'

export async function keepWizardForNoSignal() {
  if (!('serviceWorker' in navigator) || !window.isSecureContext) return
  try {
    await navigator.serviceWorker.register('/roadside-sw.js', { scope: '/road-tests/new' })
    const registration = await navigator.serviceWorker.ready
    // The page and the code it loaded before the worker was in charge; what loads later the worker keeps itself.
    const code = performance.getEntriesByType('resource').map(e => e.name).filter(n => new URL(n).pathname.startsWith('/_nuxt/'))
    registration.active?.postMessage({ type: 'keep', urls: [location.href, ...code] })
  } catch { /* without the worker the wizard still keeps what was entered; only a reload with no signal fails */ }
}

// A kept page shows the person who opened it: forgotten whenever someone signs in or out.
export async function forgetKeptPages() {
  if (typeof caches !== 'undefined') await caches.delete(ROADSIDE_CACHE).catch(() => false)
}
