// Kettlefork brew-day mode's service worker. Registered with scope /brew-days/, it answers only:
//   - brew-day mode pages (/brew-days/<id>/live): from the network, or the kept copy when offline;
//   - their JSON reads (GET /api/brew-days/<id>/live): the same way;
//   - the site's built files (/_next/static/…, named by content hash): from the kept copy first.
// Everything else, and every write, goes to the network untouched: readings made offline wait in
// the page's IndexedDB outbox, not here.

// A kept page or read is answered only to the session it was kept for: brew-day mode pages set the
// readable kf-offline-tag cookie (lib/auth/offline-tag.ts), and each kept copy carries the tag it
// was kept under. Signing out clears the cookie, the caches and the page's IndexedDB, and
// unregisters this worker (lib/brew-days/forget-device.ts).

const CACHE = 'kettlefork-brew-day-v2';
const LIVE_PAGE = /^\/brew-days\/[0-9a-f-]{36}\/live\/?$/;
const LIVE_READ = /^\/api\/brew-days\/[0-9a-f-]{36}\/live$/;
const BUILT = /^\/_next\/static\//;
const TAG_COOKIE = 'kf-offline-tag';
const TAG_HEADER = 'x-kf-offline-tag';

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

/** The signed-in session's tag; null when there is none, undefined where this browser cannot tell (no Cookie Store API). */
async function currentTag() {
  if (!self.cookieStore) return undefined;
  const cookie = await self.cookieStore.get(TAG_COOKIE).catch(() => null);
  return cookie ? cookie.value : null;
}

/** Keeps a member's page or read with the tag of the session it was fetched for (never without one). */
async function keepForSession(cache, key, response) {
  const tag = await currentTag();
  if (tag === null) return cache.delete(key);
  const headers = new Headers(response.headers);
  headers.set(TAG_HEADER, tag ?? '');
  const body = await response.blob();
  await cache.put(key, new Response(body, { status: response.status, statusText: response.statusText, headers }));
}

/** The kept copy, if it was kept for the session signed in now. */
async function keptForSession(cache, key) {
  const copy = await cache.match(key);
  if (!copy) return null;
  const tag = await currentTag();
  if (tag === undefined) return copy;
  return tag !== null && copy.headers.get(TAG_HEADER) === tag ? copy : null;
}

function noCopyPage() {
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Offline</title></head><body style="font-family: Georgia, serif; background: #fbf7f0; color: #211c16; max-width: 36rem; margin: 4rem auto; padding: 0 1rem"><h1>No connection</h1><p>This phone keeps brew-day mode for offline use only for the member who opened it while signed in. Connect and sign in to carry on.</p></body></html>`;
  return new Response(html, { status: 503, headers: { 'content-type': 'text/html; charset=utf-8' } });
}

async function networkFirst(request, key) {
  const cache = await caches.open(CACHE);
  try {
    const response = await fetch(request);
    if (kept(response)) await keepForSession(cache, key, response.clone());
    // Signed out, or no longer the brewer's: the kept copy goes too.
    else if ([401, 403, 404].includes(response.status) || response.redirected || response.type === 'opaqueredirect')
      await cache.delete(key);
    return response;
  } catch (err) {
    const copy = await keptForSession(cache, key);
    if (copy) return copy;
    if (request.mode === 'navigate') return noCopyPage();
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
  // Signing out: nothing of the member's brew days stays behind.
  if (data && data.type === 'forget') {
    event.waitUntil(
      (async () => {
        for (const name of await caches.keys()) await caches.delete(name);
        event.ports[0]?.postMessage({ type: 'forgotten' });
      })(),
    );
    return;
  }
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
          if (!kept(response)) continue;
          if (BUILT.test(path)) await cache.put(url.href, response);
          else await keepForSession(cache, path, response);
        } catch {
          // Offline already: what is kept stays kept.
        }
      }
      event.ports[0]?.postMessage({ type: 'kept' });
    })(),
  );
});
