'use client';

import { useEffect, useState } from 'react';
import Link from '@/components/link';
import { usePathname } from 'next/navigation';
import { WORKER_SCOPE, WORKER_URL, type WorkerMessage } from './worker-protocol';

/**
 * Registers Boreline's service worker (components/offline/boreline-sw.ts) from every signed-in page,
 * so the installed app's start page and the dock are kept for use with no signal. Also:
 *  - the next time any Boreline page opens (and when the signal returns), asks the worker to send the records
 *    waiting in the outbox: the fallback where the browser has no Background Sync;
 *  - shows how many records of this person still wait on the phone (and sets the app icon's badge where the
 *    browser can), with a link to the dock that holds them;
 *  - offers a new version when one is deployed, and loads it only when the person says so.
 */
export function AppWorker({ actorId }: { actorId: string }) {
  const [waiting, setWaiting] = useState<{ count: number; eventId: string | null }>({ count: 0, eventId: null });
  const [update, setUpdate] = useState<ServiceWorker | null>(null);
  const pathname = usePathname();
  const [recount, setRecount] = useState(0);

  // Counted again on every screen the person moves to (the layout stays) and when the worker sent records.
  useEffect(() => {
    let stopped = false;
    void (async () => {
      const { listWaitingOf } = await import('@/app/(app)/inspect/[eventId]/offline-queue');
      const records = await listWaitingOf(actorId);
      if (stopped) return;
      setWaiting({ count: records.length, eventId: records[0]?.eventId ?? null });
      if ('setAppBadge' in navigator)
        await (records.length ? navigator.setAppBadge(records.length) : navigator.clearAppBadge()).catch(
          () => undefined,
        );
    })().catch(() => undefined);
    return () => {
      stopped = true;
    };
  }, [actorId, pathname, recount]);

  useEffect(() => {
    if (!('serviceWorker' in navigator)) return;
    const container = navigator.serviceWorker;
    let stopped = false;

    const askToSend = (reg: ServiceWorkerRegistration) =>
      (reg.active ?? reg.waiting ?? reg.installing)?.postMessage({ type: 'send-outbox' } satisfies WorkerMessage);

    const onMessage = (e: MessageEvent) => {
      if ((e.data as WorkerMessage | null)?.type === 'outbox-changed') setRecount((n) => n + 1);
    };
    container.addEventListener('message', onMessage);

    // A worker installed while another one controls the page waits: that is a new version to offer.
    const watch = (reg: ServiceWorkerRegistration) => {
      if (reg.waiting && container.controller) setUpdate(reg.waiting);
      reg.addEventListener('updatefound', () => {
        const next = reg.installing;
        next?.addEventListener('statechange', () => {
          if (next.state === 'installed' && container.controller && !stopped) setUpdate(next);
        });
      });
    };

    let reg: ServiceWorkerRegistration | null = null;
    const onOnline = () => {
      if (reg) askToSend(reg);
    };
    window.addEventListener('online', onOnline);

    void (async () => {
      // The hand-written dock worker before this one had scope /inspect/: it goes, with its copies.
      for (const old of await container.getRegistrations())
        if (old.scope.endsWith('/inspect/')) await old.unregister().catch(() => undefined);
      reg = await container.register(WORKER_URL, { scope: WORKER_SCOPE, updateViaCache: 'none' });
      if (stopped) return;
      watch(reg);
      const ready = await container.ready;
      if (stopped) return;
      askToSend(ready);
    })().catch(() => undefined); // without a service worker every page still works online

    return () => {
      stopped = true;
      container.removeEventListener('message', onMessage);
      window.removeEventListener('online', onOnline);
    };
  }, [actorId]);

  useEffect(() => {
    if (!update) return;
    // The new version took over (here or in another tab): load it.
    const reload = () => window.location.reload();
    navigator.serviceWorker.addEventListener('controllerchange', reload);
    return () => navigator.serviceWorker.removeEventListener('controllerchange', reload);
  }, [update]);

  // The dock shows its own outbox (waiting, needs a fix, sent) beside the finder.
  const isOnDock = /^\/inspect\/[0-9a-f-]{36}$/.test(pathname);
  const showsCount = waiting.count > 0 && !isOnDock;
  if (!update && !showsCount) return null;
  return (
    <div className="mx-auto w-full max-w-6xl space-y-2 px-4 pt-3">
      {showsCount && (
        <p className="rounded-lg bg-doubt-100 p-3 font-bold text-doubt-800" role="status" data-testid="outbox-count">
          {waiting.count === 1 ? '1 record is' : `${waiting.count} records are`} waiting on this phone to be sent.{' '}
          {waiting.eventId && <Link href={`/inspect/${waiting.eventId}`}>Open the dock</Link>}
        </p>
      )}
      {update && (
        <div
          className="flex flex-wrap items-center gap-3 rounded-lg bg-tide-50 p-3"
          role="status"
          data-testid="update-ready"
        >
          <p className="font-bold text-tide-700">A new version of Boreline is ready.</p>
          <button
            type="button"
            className="btn-primary"
            onClick={() => update.postMessage({ type: 'skip-waiting' } satisfies WorkerMessage)}
          >
            Use it now
          </button>
          <span className="text-ink-soft">Records waiting on this phone are kept.</span>
        </div>
      )}
    </div>
  );
}
