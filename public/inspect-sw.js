// Service worker for the dock screen, registered from /inspect/<event> with scope /inspect/.
// Keeps the dock screen loadable with no signal once it has been visited:
//   - the page itself (navigations under /inspect/): network first, the last good copy when offline;
//   - its JS, CSS and fonts (/_next/static/, content-hashed so they never change): cache first;
//   - API reads (GET /api/events/...): network first, the last good answer when offline, marked
//     with X-Served-From: cache so the screen can say it is an offline copy;
//   - never anything but GET: records are POSTed by the page's own outbox (IndexedDB), which
//     retries with the same idempotency key; a service worker replaying POSTs could not show
//     the scrutineer what happened.
const VERSION = 'v1';
const SHELL = `boreline-inspect-shell-${VERSION}`;
const DATA = `boreline-inspect-data-${VERSION}`;

self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      const keys = await caches.keys();
      await Promise.all(
        keys.filter((k) => k.startsWith('boreline-inspect-') && k !== SHELL && k !== DATA).map((k) => caches.delete(k)),
      );
      await self.clients.claim();
    })(),
  );
});

// The page that registered us was loaded before we controlled it: it sends its own URL and the
// static files it loaded, so they are cached now rather than on the next visit.
self.addEventListener('message', (event) => {
  if (event.data?.type !== 'warm' || !Array.isArray(event.data.urls)) return;
  event.waitUntil(
    Promise.all(
      event.data.urls.map(async (href) => {
        const url = new URL(href, self.location.origin);
        if (url.origin !== self.location.origin) return;
        const isStatic = url.pathname.startsWith('/_next/static/');
        if (!isStatic && !url.pathname.startsWith('/inspect/')) return;
        try {
          const res = await fetch(url.href, { credentials: 'same-origin' });
          if (res.ok && !res.redirected) await (await caches.open(SHELL)).put(url.href, res);
        } catch {
          // offline already: nothing to warm
        }
      }),
    ),
  );
});

function offlineAnswer() {
  return new Response(
    JSON.stringify({ error: { code: 'offline', message: 'No connection, and no copy of this on the phone yet.' } }),
    {
      status: 503,
      headers: { 'content-type': 'application/json', 'X-Served-From': 'service-worker' },
    },
  );
}

async function cacheFirst(request) {
  const cache = await caches.open(SHELL);
  const hit = await cache.match(request, { ignoreVary: true });
  if (hit) return hit;
  const res = await fetch(request);
  if (res.ok) await cache.put(request, res.clone());
  return res;
}

async function networkFirst(request, cacheName, isPage) {
  const cache = await caches.open(cacheName);
  try {
    const res = await fetch(request);
    // Only a good, same-site answer is worth keeping (not a redirect to sign-in, not an error).
    if (res.ok && res.type === 'basic' && !res.redirected) await cache.put(request.url, res.clone());
    return res;
  } catch {
    const hit =
      (await cache.match(request.url, { ignoreVary: true })) ??
      (isPage ? await cache.match(request.url, { ignoreVary: true, ignoreSearch: true }) : undefined);
    if (!hit)
      return isPage
        ? new Response(
            '<!doctype html><title>Offline</title><p style="font:20px sans-serif;padding:1rem">No connection, and this page was not saved on the phone yet. Open it once with a signal.</p>',
            { status: 503, headers: { 'content-type': 'text/html; charset=utf-8' } },
          )
        : offlineAnswer();
    const headers = new Headers(hit.headers);
    headers.set('X-Served-From', 'cache');
    return new Response(await hit.blob(), { status: hit.status, statusText: hit.statusText, headers });
  }
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return; // never cache POSTs (or any other change)
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (url.pathname.startsWith('/_next/static/')) {
    event.respondWith(cacheFirst(request));
  } else if (request.mode === 'navigate' && url.pathname.startsWith('/inspect/')) {
    event.respondWith(networkFirst(request, SHELL, true));
  } else if (url.pathname.startsWith('/api/events/') && !request.headers.get('RSC')) {
    event.respondWith(networkFirst(request, DATA, false));
  }
  // Anything else (client-side navigation payloads, other pages) goes to the network as usual.
});
