'use client';

import { useCallback, useEffect, useState, useSyncExternalStore } from 'react';
import { listQueued, removeQueued, sendWaiting, type QueuedRecord } from '@/app/(app)/inspect/[eventId]/offline-queue';
import { loadDockParts } from './dock-parts';
import { OUTBOX_SYNC_TAG, WORKER_SCOPE, WORKER_URL, type WorkerMessage } from '@/components/offline/worker-protocol';

const RETRY_MS = 15_000;

function subscribeToConnection(onChange: () => void) {
  window.addEventListener('online', onChange);
  window.addEventListener('offline', onChange);
  return () => {
    window.removeEventListener('online', onChange);
    window.removeEventListener('offline', onChange);
  };
}

/**
 * The phone's outbox for one meeting, kept in step with IndexedDB. Sends when the browser says it
 * is back online, on a timer (the 'online' event is not always fired on flaky networks) and on demand.
 */
export function useDockQueue(eventId: string, actorId: string) {
  const [records, setRecords] = useState<QueuedRecord[]>([]);
  const isOnline = useSyncExternalStore(
    subscribeToConnection,
    () => navigator.onLine,
    () => true,
  );
  const refresh = useCallback(async () => setRecords(await listQueued(eventId)), [eventId]);
  const flush = useCallback(async () => {
    if (!navigator.onLine) return;
    await sendWaiting(eventId, actorId);
    await refresh();
  }, [eventId, actorId, refresh]);

  useEffect(() => {
    const first = window.setTimeout(() => void refresh().then(flush), 0);
    const up = () => void flush();
    window.addEventListener('online', up);
    const timer = window.setInterval(() => void flush(), RETRY_MS);
    // The service worker sent records (Background Sync, or another page opening): show them as sent.
    const fromWorker = (e: MessageEvent) => {
      if ((e.data as WorkerMessage | null)?.type === 'outbox-changed') void refresh();
    };
    navigator.serviceWorker?.addEventListener('message', fromWorker);
    return () => {
      window.clearTimeout(first);
      window.removeEventListener('online', up);
      window.clearInterval(timer);
      navigator.serviceWorker?.removeEventListener('message', fromWorker);
    };
  }, [refresh, flush]);

  const remove = useCallback(
    async (r: QueuedRecord) => {
      await removeQueued(r.idempotencyKey);
      await refresh();
    },
    [refresh],
  );

  return { records, isOnline, refresh, flush, remove };
}

/**
 * A record waits: ask the browser to wake the service worker when the connection returns, even if this page
 * is closed by then (Background Sync, where the browser has it; elsewhere the next Boreline page to open asks
 * the worker to send, components/offline/app-worker.tsx).
 */
export async function askForBackgroundSend(): Promise<boolean> {
  if (!('serviceWorker' in navigator)) return false;
  const reg = (await navigator.serviceWorker.getRegistration(WORKER_SCOPE)) as
    (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined;
  if (!reg?.active || !reg.sync) return false;
  return reg.sync.register(OUTBOX_SYNC_TAG).then(
    () => true,
    () => false,
  );
}

/**
 * Registers Boreline's service worker (as every signed-in page does) and hands it this page's files to keep
 * for offline use.
 * The page may have been reached by a client-side link from outside the scope (from /home, say):
 * then the worker does not control it and `navigator.serviceWorker.ready` would never resolve for
 * it, so the registration's own worker is used. The next load of the page (a reload with no
 * signal included) is served through the worker.
 */
export function registerInspectServiceWorker() {
  if (!('serviceWorker' in navigator)) return;
  void navigator.serviceWorker
    .register(WORKER_URL, { scope: WORKER_SCOPE, updateViaCache: 'none' })
    .then(async (reg) => {
      const worker =
        reg.active ??
        (await new Promise<ServiceWorker | null>((resolve) => {
          const w = reg.installing ?? reg.waiting;
          if (!w) return resolve(null);
          w.addEventListener('statechange', () =>
            w.state === 'activated' ? resolve(w) : w.state === 'redundant' ? resolve(null) : undefined,
          );
        }));
      // The parts that appear once a boat is found, fetched while the phone is idle (the screen's first
      // load does without them), so they are among the files the worker keeps for use with no signal.
      await new Promise<void>((resolve) =>
        'requestIdleCallback' in window
          ? requestIdleCallback(() => resolve(), { timeout: 5000 })
          : setTimeout(resolve, 1000),
      );
      await loadDockParts().catch(() => undefined);
      const files = performance
        .getEntriesByType('resource')
        .map((e) => e.name)
        .filter((u) => u.includes('/_next/static/'));
      worker?.postMessage({ type: 'warm', urls: [location.href, ...files] } satisfies WorkerMessage);
    })
    .catch(() => undefined); // without a service worker the screen still works online, and the outbox offline
}
