// What Boreline's pages and its service worker (components/offline/boreline-sw.ts) say to each other, and the
// names they share. No imports: both bundles take it.

/** Background Sync's tag for the dock's outbox (the page registers it when a record waits; the worker sends). */
export const OUTBOX_SYNC_TAG = 'boreline-outbox';

/** The caches holding one person's pages and data: emptied on sign-out (the precache holds build files only). */
export const PERSONAL_CACHES = ['boreline-pages', 'boreline-data'] as const;

/** Where the worker is served (app/boreline-sw.js/route.ts) and what it controls. */
export const WORKER_URL = '/boreline-sw.js';
export const WORKER_SCOPE = '/';

export type WorkerMessage =
  /** page → worker: the person chose to load the new version now. */
  | { type: 'skip-waiting' }
  /** page → worker: send the outbox now (a Boreline page opened, or the signal came back). */
  | { type: 'send-outbox' }
  /** page → worker: keep these (the page's own address and the build files it loaded). */
  | { type: 'warm'; urls: string[] }
  /** worker → pages: records were sent; read the outbox again. */
  | { type: 'outbox-changed' };
