// Kettlefork brew-day mode's service worker. Registered with scope /brew-days/, it answers only:
//   - brew-day mode pages (/brew-days/<id>/live): from the network, or the kept copy when offline;
//   - their JSON reads (GET /api/brew-days/<id>/live): the same way;
//   - the site's built files (/_next/static/…, named by content hash): from the kept copy first.
// Everything else, and every write, goes to the network untouched: readings made offline wait in
// the page's IndexedDB outbox, not here.

const CACHE = 'kettlefork-brew-day-v1';
const LIVE_PAGE = /^\/brew-days\/[0-9a-f-]{36}\/live\/?$/;
const LIVE_READ = /^\/api\/brew-days\/[0-9a-f-]{36}\/live$/;
const BUILT = /^\/_next\/static\//;

self.addEventListener('install', () => {
  self.skipWaiting();
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys()) if (name !== CACHE) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

function kept(response) {
  return response.ok && !response.redirected && response.type === 'basic';
}

async function networkFirst(request, key) {
  const cache = await caches.open(CACHE);
  try {
    const response = await fetch(request);
    if (kept(response)) await cache.put(key, response.clone());
    return response;
  } catch (err) {
    const copy = await cache.match(key);
    if (copy) return copy;
    throw err;
  }
}

async function cacheFirst(request) {
  const cache = await caches.open(CACHE);
  const copy = await cache.match(request);
  if (copy) return copy;
  const response = await fetch(request);
  if (kept(response)) await cache.put(request, response.clone());
  return response;
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (LIVE_PAGE.test(url.pathname) && request.mode === 'navigate') {
    event.respondWith(networkFirst(request, url.pathname));
  } else if (LIVE_READ.test(url.pathname)) {
    event.respondWith(networkFirst(request, url.pathname));
  } else if (BUILT.test(url.pathname)) {
    event.respondWith(cacheFirst(request));
  }
});

// The page names what it loaded on its first visit (before this worker controlled it), so that
// visit can be reopened offline too; the reply on the given port says when all of it is kept.
self.addEventListener('message', (event) => {
  const data = event.data;
  if (!data || data.type !== 'keep' || !Array.isArray(data.urls)) return;
  event.waitUntil(
    (async () => {
      const cache = await caches.open(CACHE);
      for (const raw of data.urls) {
        const url = new URL(raw, self.location.origin);
        if (url.origin !== self.location.origin) continue;
        const path = url.pathname;
        if (!LIVE_PAGE.test(path) && !LIVE_READ.test(path) && !BUILT.test(path)) continue;
        if (BUILT.test(path) && (await cache.match(url.href))) continue;
        try {
          const response = await fetch(url.href, { credentials: 'same-origin' });
          if (kept(response)) await cache.put(BUILT.test(path) ? url.href : path, response);
        } catch {
          // Offline already: what is kept stays kept.
        }
      }
      event.ports[0]?.postMessage({ type: 'kept' });
    })(),
  );
});
