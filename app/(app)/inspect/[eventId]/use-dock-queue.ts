'use client';

import { useCallback, useEffect, useState, useSyncExternalStore } from 'react';
import { listQueued, removeQueued, sendWaiting, type QueuedRecord } from '@/app/(app)/inspect/[eventId]/offline-queue';
import { loadDockParts } from './dock-parts';

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
    return () => {
      window.clearTimeout(first);
      window.removeEventListener('online', up);
      window.clearInterval(timer);
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
 * Registers the dock's service worker and hands it this page's files to keep for offline use.
 * The page may have been reached by a client-side link from outside the scope (from /home, say):
 * then the worker does not control it and `navigator.serviceWorker.ready` would never resolve for
 * it, so the registration's own worker is used. The next load of the page (a reload with no
 * signal included) is served through the worker.
 */
export function registerInspectServiceWorker() {
  if (!('serviceWorker' in navigator)) return;
  void navigator.serviceWorker
    .register('/inspect-sw.js', { scope: '/inspect/' })
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
      worker?.postMessage({ type: 'warm', urls: [location.href, ...files] });
    })
    .catch(() => undefined); // without a service worker the screen still works online, and the outbox offline
}
