// The road-test wizard's page and its code, kept on the phone so that a reload with no signal still opens the
// wizard with what the phone kept (docs/road-tests.md#no-signal). It controls that page alone (scope
// /road-tests/new); answers of the API are never kept; the page is kept per address and served only when the
// network cannot be reached. Signing in or out empties the cache (app/utils/roadside-worker.ts).
const CACHE = 'voltwright-roadside-v1'

const isPage = url => url.pathname === '/road-tests/new'
const isAsset = url => url.pathname.startsWith('/_nuxt/') && !url.pathname.startsWith('/_nuxt/builds/')
const sameOrigin = url => url.origin === self.location.origin
const keepable = response => response && response.ok && !response.redirected && response.type === 'basic'

self.addEventListener('install', () => self.skipWaiting())
self.addEventListener('activate', event => event.waitUntil(self.clients.claim()))

// The page tells the worker what it loaded before the worker controlled it: its address and its code.
self.addEventListener('message', (event) => {
  if (event.data?.type === 'keep' && Array.isArray(event.data.urls)) event.waitUntil(keep(event.data.urls))
})

async function keep(urls) {
  const cache = await caches.open(CACHE)
  const wanted = urls.map(u => new URL(u, self.location.origin)).filter(u => sameOrigin(u) && (isPage(u) || isAsset(u)))
  for (const url of wanted) {
    if (isAsset(url) && await cache.match(url)) continue
    const response = await fetch(url, { credentials: 'same-origin' }).catch(() => null)
    if (keepable(response)) await cache.put(url, response)
  }
  // Code of an earlier build is dropped: the names change with every build.
  const current = new Set(wanted.map(u => u.href))
  for (const request of await cache.keys()) {
    const url = new URL(request.url)
    if (isAsset(url) && !current.has(url.href) && urls.length > 1) await cache.delete(request)
  }
}

self.addEventListener('fetch', (event) => {
  const url = new URL(event.request.url)
  if (event.request.method !== 'GET' || !sameOrigin(url)) return
  if (event.request.mode === 'navigate' && isPage(url)) event.respondWith(networkFirst(event.request))
  else if (isAsset(url)) event.respondWith(cacheFirst(event.request))
})

async function networkFirst(request) {
  try {
    const response = await fetch(request)
    if (keepable(response)) await (await caches.open(CACHE)).put(request, response.clone())
    return response
  } catch (err) {
    const kept = await (await caches.open(CACHE)).match(request)
    if (!kept) throw err
    // Marked, so that whoever looks (a test, a developer's tools) sees it came from the phone.
    const headers = new Headers(kept.headers)
    headers.set('X-Voltwright-Kept', 'no signal')
    return new Response(kept.body, { status: kept.status, statusText: kept.statusText, headers })
  }
}

async function cacheFirst(request) {
  const cache = await caches.open(CACHE)
  const kept = await cache.match(request)
  if (kept) return kept
  const response = await fetch(request)
  if (keepable(response)) await cache.put(request, response.clone())
  return response
}
