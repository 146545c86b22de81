// Boreline's service worker, built on Serwist (the `serwist` package: precaching, routing, caching strategies).
// scripts/build-sw.mjs bundles this file with esbuild after `next build` and writes the precache list into it
// (BORELINE_PRECACHE); GET /boreline-sw.js serves the result, registered with scope / by components/offline/app-worker.tsx.
//
// What it keeps, and for how long (every cache is named boreline-*; signing out empties all but the precache):
//   - precache: the build's script, style and font files of the screens a scrutineer opens (home, the inspect list,
//     the dock, its queue and board) and the app's icons: the same files for everyone, replaced as a whole by the
//     next version's worker;
//   - pages of the signed-in areas a scrutineer uses (/home, /inspect/...): network first, the last good copy when
//     there is no signal, marked X-Served-From: cache (boreline-pages, personal: cleared on sign-out);
//   - the dock's data (GET /api/events/...): the same, with a JSON 503 "offline" answer when there is no copy
//     (boreline-data, personal);
//   - other build files (/_next/static/, content-hashed, so they never change): cache first (boreline-static);
//   - fonts: cache first; images of the app itself (not uploads, which come from /api/): stale while revalidate.
//   - never a POST or any other change: records go through the phone's outbox (IndexedDB), which this worker
//     also sends, with each record's idempotency key, when Background Sync fires or any Boreline page opens.
import {
  CacheFirst,
  ExpirationPlugin,
  NetworkFirst,
  Serwist,
  setCacheNameDetails,
  StaleWhileRevalidate,
  type PrecacheEntry,
  type SerwistPlugin,
} from 'serwist';
import { sendAllWaiting } from '../../app/(app)/inspect/[eventId]/offline-queue';
import { OUTBOX_SYNC_TAG, PERSONAL_CACHES, type WorkerMessage } from './worker-protocol';

// The few service-worker types used here (the project compiles against the DOM library, not the worker one).
type ExtendableEvent = Event & { waitUntil(p: Promise<unknown>): void };
type SyncEvent = ExtendableEvent & { tag: string; lastChance: boolean };
type MessageEvent = ExtendableEvent & { data: unknown };
type WorkerClient = { url: string; postMessage(message: unknown): void };
type WorkerScope = {
  location: Location;
  skipWaiting(): Promise<void>;
  clients: { matchAll(o?: { type?: string; includeUncontrolled?: boolean }): Promise<WorkerClient[]> };
  addEventListener(type: 'sync', fn: (e: SyncEvent) => void): void;
  addEventListener(type: 'message' | 'activate', fn: (e: MessageEvent) => void): void;
};
const sw = self as unknown as WorkerScope;

declare const BORELINE_PRECACHE: PrecacheEntry[];

const [PAGES, DATA] = PERSONAL_CACHES;

/** A copy from the phone says so, as the hand-written worker before this one did (the dock shows "offline copy"). */
async function markedCopy(cached: Response): Promise<Response> {
  const headers = new Headers(cached.headers);
  headers.set('X-Served-From', 'cache');
  return new Response(await cached.blob(), { status: cached.status, statusText: cached.statusText, headers });
}
const markCopies: SerwistPlugin = {
  cachedResponseWillBeUsed: async ({ cachedResponse }) =>
    cachedResponse ? markedCopy(cachedResponse) : cachedResponse,
};

/** Only a good, same-site answer is kept: not a redirect to sign-in, not an error, not another site's. */
const keepGoodAnswers: SerwistPlugin = {
  cacheWillUpdate: async ({ response }) =>
    response.ok && response.type === 'basic' && !response.redirected ? response : null,
};

const OFFLINE_PAGE =
  '<!doctype html><html lang="en"><meta name="viewport" content="width=device-width,initial-scale=1"><title>Offline · Boreline</title>' +
  '<p style="font:20px sans-serif;padding:1rem">No connection, and this page was not saved on the phone yet. Open it once with a signal.</p>';

/** No network and no copy: a page says so in words; the dock's data answers in the app's error shape. */
const answerOffline = (isPage: boolean): SerwistPlugin => ({
  handlerDidError: async ({ request }) => {
    if (isPage) {
      // The same page with other search words (?race=42) is the same screen: better than nothing. The page with no
      // search words first (for a boat's link, the plain dock), then any.
      const pages = await caches.open(PAGES);
      const url = new URL(request.url);
      const near =
        (await pages.match(new URL(url.pathname, url.origin).href, { ignoreVary: true })) ??
        (await pages.match(request.url, { ignoreSearch: true, ignoreVary: true }));
      if (near) return markedCopy(near);
      return new Response(OFFLINE_PAGE, { status: 503, headers: { 'content-type': 'text/html; charset=utf-8' } });
    }
    return new Response(
      JSON.stringify({ error: { code: 'offline', message: 'No connection, and no copy of this on the phone yet.' } }),
      { status: 503, headers: { 'content-type': 'application/json', 'X-Served-From': 'service-worker' } },
    );
  },
});

// The signed-in areas whose pages a scrutineer opens at the dock (and the installed app's start page).
const KEPT_PAGES = /^\/(home|inspect)(\/|$)/;
const LAST_DOCK = '/__boreline/last-dock';
const DOCK_PAGE = /^\/inspect\/[0-9a-f-]{36}$/;

/** The dock screen last kept: where the shortcut goes with no signal. */
const rememberDock: SerwistPlugin = {
  cacheDidUpdate: async ({ request, cacheName }) => {
    const path = new URL(request.url).pathname;
    if (DOCK_PAGE.test(path)) await (await caches.open(cacheName)).put(LAST_DOCK, new Response(path));
  },
};

/** A dock page opened for one boat (?race=, ?tag=): its HTML may carry that boat's card as the server saw it. */
// Any spelling of the meeting's id (the app reads it in any case, and %-escaped), so none slips past as another page.
const isOneBoatDock = (url: URL) =>
  /^\/inspect\/[^/]+\/?$/i.test(url.pathname) && (url.searchParams.has('race') || url.searchParams.has('tag'));

/**
 * Such a page is never kept: with no signal the phone shows the plain dock instead (answerOffline finds it by its
 * path), which looks the boat up in the phone's copy of the entries and says the card is a copy, rather than an
 * old card shown as if fresh, or another boat's. The plain dock is kept the first time a boat's page is opened,
 * so a dock only ever opened from links still works with no signal.
 */
const keepPlainDockInstead: SerwistPlugin = {
  cacheWillUpdate: async ({ request, response }) => (isOneBoatDock(new URL(request.url)) ? null : response),
  fetchDidSucceed: async ({ request, response, event }) => {
    const url = new URL(request.url);
    if (response.ok && request.mode === 'navigate' && isOneBoatDock(url)) {
      const cache = await caches.open(PAGES);
      const plain = new URL(url.pathname, url.origin).href;
      if (!(await cache.match(plain, { ignoreVary: true }))) {
        const kept = fetch(plain, { credentials: 'same-origin' })
          .then(async (r) => {
            if (!r.ok || r.redirected) return;
            await cache.put(plain, r);
            await cache.put(LAST_DOCK, new Response(url.pathname));
          })
          .catch(() => undefined);
        // The worker stays up until the plain dock is kept (the page's own answer is not held back for it).
        (event as ExtendableEvent | undefined)?.waitUntil?.(kept);
      }
    }
    return response;
  },
};

// Serwist's own caches (the precache) are named boreline-… too; set before the precache is made.
setCacheNameDetails({ prefix: 'boreline' });

const serwist = new Serwist({
  precacheEntries: BORELINE_PRECACHE,
  precacheOptions: { cleanupOutdatedCaches: true },
  // A new version waits until the person says so (the update prompt), so a record being typed is never cut off.
  skipWaiting: false,
  clientsClaim: true,
  navigationPreload: false,
  disableDevLogs: true,
  runtimeCaching: [
    {
      matcher: ({ request, url, sameOrigin }) =>
        sameOrigin && request.mode === 'navigate' && url.pathname === '/inspect/current',
      handler: async ({ request }) => {
        // The shortcut's address redirects to the current meeting's dock; with no signal, to the last dock kept.
        try {
          return await fetch(request);
        } catch {
          const last = await (await caches.open(PAGES)).match(LAST_DOCK);
          const to = last ? await last.text() : '/inspect';
          return Response.redirect(new URL(to, sw.location.origin).href, 302);
        }
      },
    },
    {
      matcher: ({ request, url, sameOrigin }) =>
        sameOrigin && request.mode === 'navigate' && KEPT_PAGES.test(url.pathname),
      handler: new NetworkFirst({
        cacheName: PAGES,
        matchOptions: { ignoreVary: true },
        plugins: [keepGoodAnswers, keepPlainDockInstead, rememberDock, markCopies, answerOffline(true)],
      }),
    },
    {
      matcher: ({ request, url, sameOrigin }) =>
        sameOrigin && url.pathname.startsWith('/api/events/') && !request.headers.get('RSC'),
      handler: new NetworkFirst({
        cacheName: DATA,
        matchOptions: { ignoreVary: true },
        plugins: [keepGoodAnswers, markCopies, answerOffline(false)],
      }),
    },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/_next/static/'),
      handler: new CacheFirst({
        cacheName: 'boreline-static',
        matchOptions: { ignoreVary: true },
        plugins: [keepGoodAnswers, new ExpirationPlugin({ maxEntries: 300, maxAgeSeconds: 60 * 24 * 60 * 60 })],
      }),
    },
    {
      matcher: ({ request, sameOrigin }) => sameOrigin && request.destination === 'font',
      handler: new CacheFirst({
        cacheName: 'boreline-fonts',
        plugins: [keepGoodAnswers, new ExpirationPlugin({ maxEntries: 20, maxAgeSeconds: 365 * 24 * 60 * 60 })],
      }),
    },
    {
      matcher: ({ request, url, sameOrigin }) =>
        sameOrigin && request.destination === 'image' && !url.pathname.startsWith('/api/'),
      handler: new StaleWhileRevalidate({
        cacheName: 'boreline-images',
        plugins: [keepGoodAnswers, new ExpirationPlugin({ maxEntries: 60, maxAgeSeconds: 30 * 24 * 60 * 60 })],
      }),
    },
  ],
});
serwist.addEventListeners();

/** Tells every open Boreline page that the outbox changed (the dock re-reads it, the header its count). */
async function announce(message: WorkerMessage) {
  for (const c of await sw.clients.matchAll({ type: 'window', includeUncontrolled: true })) c.postMessage(message);
}

/** Who is signed in on this phone now (next-auth's session endpoint); null when nobody, or no answer. */
async function signedInPersonId(): Promise<string | null | 'no-answer'> {
  try {
    const res = await fetch('/api/auth/session', { credentials: 'same-origin', cache: 'no-store' });
    if (!res.ok) return 'no-answer';
    const session = (await res.json().catch(() => null)) as { user?: { id?: unknown } } | null;
    return typeof session?.user?.id === 'string' ? session.user.id : null;
  } catch {
    return 'no-answer';
  }
}

let sending: Promise<number> | null = null;
/**
 * Sends the waiting records of the person signed in now (a phone shared by two scrutineers sends each one's
 * records only under their own sign-in) and returns how many still wait; -1 when there was no answer at all.
 */
function sendOutbox(): Promise<number> {
  sending ??= (async () => {
    try {
      const who = await signedInPersonId();
      if (who === 'no-answer') return -1;
      if (who === null) return 0; // signed out: they wait for their owner's next sign-in
      const { sent, waiting } = await sendAllWaiting(who);
      if (sent) await announce({ type: 'outbox-changed' });
      return waiting;
    } finally {
      sending = null;
    }
  })();
  return sending;
}

/**
 * The browser fires "sync" as the connection comes back, sometimes a moment before requests go through (a
 * phone between networks, a busy one): a few tries within the same event (2, 4, 6 s apart) before handing
 * back to the browser, whose own retry comes minutes later.
 */
async function sendSoon(): Promise<number> {
  let waiting = await sendOutbox();
  for (let i = 1; i <= 3 && waiting !== 0; i++) {
    await new Promise((resolve) => setTimeout(resolve, 2000 * i));
    waiting = await sendOutbox();
  }
  return waiting;
}

sw.addEventListener('sync', (event) => {
  if (event.tag !== OUTBOX_SYNC_TAG) return;
  // Rejecting tells the browser to try again later (with back-off), until its last chance.
  event.waitUntil(
    sendSoon().then((waiting) => {
      if (waiting !== 0 && !event.lastChance) throw new Error(`${waiting} record(s) still waiting`);
    }),
  );
});

sw.addEventListener('message', (event) => {
  const data = event.data as WorkerMessage | null;
  if (data?.type === 'skip-waiting') event.waitUntil(sw.skipWaiting());
  else if (data?.type === 'send-outbox') event.waitUntil(sendOutbox());
  else if (data?.type === 'warm') event.waitUntil(warm(data.urls));
});

// A page loaded before this worker controlled it sends its own address and the build files it loaded (and the
// dock the parts it fetched at idle), so they are kept now rather than on the next visit.
async function warm(urls: unknown) {
  if (!Array.isArray(urls)) return;
  await Promise.all(
    urls.slice(0, 300).map(async (href) => {
      if (typeof href !== 'string') return;
      const asked = new URL(href, sw.location.origin);
      if (asked.origin !== sw.location.origin) return;
      // A boat's dock page is never kept (keepPlainDockInstead): the plain dock is.
      const url = isOneBoatDock(asked) ? new URL(asked.pathname, asked.origin) : asked;
      const isStatic = url.pathname.startsWith('/_next/static/');
      if (!isStatic && !KEPT_PAGES.test(url.pathname)) return;
      const cache = await caches.open(isStatic ? 'boreline-static' : PAGES);
      if (isStatic && (await caches.match(url.href, { ignoreVary: true }))) return;
      try {
        const res = await fetch(url.href, { credentials: 'same-origin' });
        if (!res.ok || res.redirected) return;
        await cache.put(url.href, res);
        if (DOCK_PAGE.test(url.pathname)) await cache.put(LAST_DOCK, new Response(url.pathname));
      } catch {
        // offline already: nothing to warm
      }
    }),
  );
}

sw.addEventListener('activate', (event) => {
  // The hand-written worker before this one (scope /inspect/) kept its copies under these names; a worker before
  // keepPlainDockInstead kept boats' dock pages, whose HTML now holds a card: both go.
  event.waitUntil(
    Promise.all([
      caches
        .keys()
        .then((keys) =>
          Promise.all(keys.filter((k) => k.startsWith('boreline-inspect-')).map((k) => caches.delete(k))),
        ),
      caches.open(PAGES).then(async (pages) => {
        for (const request of await pages.keys()) if (isOneBoatDock(new URL(request.url))) await pages.delete(request);
      }),
    ]),
  );
});
