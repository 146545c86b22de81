// Retired. The dock's hand-written service worker (scope /inspect/) was replaced by Boreline's worker built on
// Serwist (GET /boreline-sw.js, scope /; components/offline/boreline-sw.ts). A phone that still has this one
// fetches this version on its next update check: it empties the old copies and unregisters itself, so the new
// worker controls the dock. It answers no request. (The pages also unregister it: components/offline/app-worker.tsx.)
self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      const keys = await caches.keys();
      await Promise.all(keys.filter((k) => k.startsWith('boreline-inspect-')).map((k) => caches.delete(k)));
      await self.registration.unregister();
    })(),
  );
});
