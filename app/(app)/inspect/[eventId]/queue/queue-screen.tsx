'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { requestJson } from '@/components/forms/request-json';
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { queueStatus, QUEUE_STATUS_LABELS, type QueueStatus } from '@/lib/core/schedule/queue-status';
import type { DockQueue, QueueRow } from '@/lib/server/schedule/dock-queue';
import { registerInspectServiceWorker } from '../use-dock-queue';
import { listCheckIns, loadQueue, putCheckIn, removeCheckIn, saveQueue, type PendingCheckIn } from './queue-store';

// The dock's queue on a phone: who is due, who has arrived, who is late, and walk-ins. Check-ins are
// saved on the phone first and sent with their key (queue-store.ts), so a lost signal loses nothing and
// a retry stores nothing twice. "Late" is recomputed here from the last server time and the phone's
// clock, so the list stays right while offline. Small on purpose: no libraries beyond the dock's own.

const STATUS_ORDER: QueueStatus[] = ['late', 'due', 'upcoming', 'arrived'];
const REFRESH_MS = 30_000;
// After a send that found no connection (or a busy server), the next try comes sooner than the refresh: 2 s,
// then doubling up to the refresh's 30 s. Signal at a dock comes and goes, and the 'online' event may fire
// before the connection really carries requests (or not at all).
const FIRST_RETRY_MS = 2_000;

function hhmm(iso: string, timeZone: string) {
  return format(new TZDate(new Date(iso).getTime(), timeZone), 'HH:mm');
}

export function QueueScreen({
  eventId,
  actorId,
  canCheckIn,
}: {
  eventId: string;
  actorId: string;
  canCheckIn: boolean;
}) {
  const [queue, setQueue] = useState<DockQueue | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [pending, setPending] = useState<PendingCheckIn[]>([]);
  const [offline, setOffline] = useState(false);
  const [now, setNow] = useState(() => new Date());
  const [walkIn, setWalkIn] = useState('');
  const [message, setMessage] = useState<string | null>(null);

  const refresh = useCallback(async () => {
    const answer = await requestJson<DockQueue>(`/api/events/${eventId}/slots/queue`, {
      method: 'GET',
      cache: 'no-store',
    });
    // The dock's service worker answers from its saved copy when there is no signal: that is not fresh.
    if (answer.ok && answer.headers.get('x-served-from') !== 'cache') {
      setQueue(answer.data);
      setSavedAt(null);
      setOffline(false);
      await saveQueue(eventId, answer.data);
    } else {
      setOffline(answer.ok || answer.status === 0);
      const saved = await loadQueue(eventId);
      if (saved) {
        setQueue(saved.queue);
        setSavedAt(saved.savedAt);
      }
    }
    setPending(await listCheckIns(eventId));
  }, [eventId]);

  const retry = useRef<{ timer: ReturnType<typeof setTimeout> | null; delay: number; send: () => Promise<void> }>({
    timer: null,
    delay: FIRST_RETRY_MS,
    send: async () => undefined,
  });
  const sendPending = useCallback(async () => {
    const r = retry.current;
    if (r.timer) clearTimeout(r.timer);
    r.timer = null;
    let failed = false;
    for (const c of await listCheckIns(eventId)) {
      if (c.state !== 'waiting' || c.recordedById !== actorId) continue;
      const answer = await requestJson(`/api/events/${eventId}/slots/arrivals`, {
        body: { key: c.key, entryId: c.entryId, arrivedAt: c.arrivedAt, bay: c.bay },
      });
      if (answer.ok) await removeCheckIn(c.key);
      else if (answer.status === 0 || answer.status >= 500 || answer.status === 429) {
        setOffline(answer.status === 0);
        failed = true;
        break; // waiting will cure it: try again soon, in order
      } else await putCheckIn({ ...c, state: 'needs_fix', message: answer.message });
    }
    if (failed) {
      r.timer = setTimeout(() => void r.send(), r.delay);
      r.delay = Math.min(r.delay * 2, REFRESH_MS);
    } else r.delay = FIRST_RETRY_MS;
    await refresh();
  }, [eventId, actorId, refresh]);
  useEffect(() => {
    const r = retry.current;
    r.send = sendPending;
    return () => {
      if (r.timer) clearTimeout(r.timer);
      r.timer = null;
    };
  }, [sendPending]);

  // The dock's service worker keeps this page too, so it opens again with no signal.
  useEffect(() => registerInspectServiceWorker(), []);

  useEffect(() => {
    const first = setTimeout(() => void sendPending(), 0);
    const timer = setInterval(() => void sendPending(), REFRESH_MS);
    const tick = setInterval(() => setNow(new Date()), 15_000);
    const online = () => void sendPending();
    window.addEventListener('online', online);
    return () => {
      clearTimeout(first);
      clearInterval(timer);
      clearInterval(tick);
      window.removeEventListener('online', online);
    };
  }, [sendPending]);

  async function checkIn(entryId: string, label: string) {
    const c: PendingCheckIn = {
      key: crypto.randomUUID(),
      eventId,
      recordedById: actorId,
      entryId,
      label,
      arrivedAt: new Date().toISOString(),
      bay: '',
      state: 'waiting',
      message: null,
    };
    await putCheckIn(c);
    setPending(await listCheckIns(eventId));
    setMessage(`No. ${label} checked in on this phone.`);
    await sendPending();
  }

  if (!queue) return <p data-testid="queue-loading">Loading the queue…</p>;
  const waitingIds = new Set(pending.filter((p) => p.state === 'waiting').map((p) => p.entryId));
  const statusOf = (r: QueueRow): QueueStatus =>
    waitingIds.has(r.entryId)
      ? 'arrived'
      : r.slotStartsAt
        ? queueStatus({ startsAt: r.slotStartsAt, graceMinutes: r.graceMinutes, arrivedAt: r.arrivedAt }, now)
        : 'arrived';
  const rows = [...queue.rows].sort((a, b) => STATUS_ORDER.indexOf(statusOf(a)) - STATUS_ORDER.indexOf(statusOf(b)));
  return (
    <div className="space-y-4">
      <p className="text-base text-ink-soft" data-testid="queue-day">
        {queue.day}, times in {queue.timeZone}.{' '}
        {savedAt && (
          <span data-testid="queue-saved-copy">
            No connection: showing the copy saved {hhmm(savedAt, queue.timeZone)}.
          </span>
        )}
        {offline && !savedAt && <span>No connection.</span>}
      </p>
      <p role="status" aria-live="polite" className="text-base" data-testid="queue-message">
        {message}
        {pending.some((p) => p.state === 'waiting') &&
          ` ${pending.filter((p) => p.state === 'waiting').length} check-in(s) waiting to be sent.`}
      </p>
      {pending
        .filter((p) => p.state === 'needs_fix')
        .map((p) => (
          <div key={p.key} className="card border-danger" data-testid="checkin-needs-fix">
            <p>
              Check-in of no. {p.label} was refused: {p.message}
            </p>
            <button type="button" className="btn-secondary" onClick={() => void removeCheckIn(p.key).then(refresh)}>
              Remove from this phone
            </button>
          </div>
        ))}
      {rows.length === 0 && <p className="card text-ink-soft">No boats are booked for this day.</p>}
      <ul className="space-y-2" data-testid="queue-list">
        {rows.map((r) => {
          const status = statusOf(r);
          return (
            <li
              key={`${r.entryId}-${r.walkIn}`}
              className="card flex flex-wrap items-center justify-between gap-2"
              data-entry={r.entryId}
              data-status={status}
            >
              <div>
                <p className="font-bold">
                  <span className="figure">no. {r.raceNumber}</span> {r.boatName} · {r.classCode}
                </p>
                <p className="text-base">
                  {r.walkIn ? 'Walk-in' : `${r.bay}, ${hhmm(r.slotStartsAt!, queue.timeZone)}`} ·{' '}
                  <strong>{QUEUE_STATUS_LABELS[status]}</strong>
                  {r.arrivedAt && ` at ${hhmm(r.arrivedAt, queue.timeZone)}`}
                </p>
              </div>
              {canCheckIn && status !== 'arrived' && (
                <button
                  type="button"
                  className="btn-primary min-h-touch"
                  onClick={() => void checkIn(r.entryId, String(r.raceNumber))}
                >
                  Check in no. {r.raceNumber}
                </button>
              )}
            </li>
          );
        })}
      </ul>
      {canCheckIn && <WalkInForm eventId={eventId} value={walkIn} onChange={setWalkIn} onCheckIn={checkIn} />}
    </div>
  );
}

function WalkInForm({
  eventId,
  value,
  onChange,
  onCheckIn,
}: {
  eventId: string;
  value: string;
  onChange: (v: string) => void;
  onCheckIn: (entryId: string, label: string) => Promise<void>;
}) {
  const [error, setError] = useState<string | null>(null);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const n = Number(value.trim());
    if (!Number.isInteger(n) || n < 1 || n > 9999) return setError('Enter a race number from 1 to 9999.');
    // The entry behind the race number (the dock's lookup; its answer is cached for use offline).
    const answer = await requestJson<{ entry: { id: string } }>(`/api/events/${eventId}/race-numbers/${n}`, {
      method: 'GET',
    });
    if (!answer.ok)
      return setError(answer.status === 404 ? `No boat with race number ${n} at this meeting.` : answer.message);
    setError(null);
    onChange('');
    await onCheckIn(answer.data.entry.id, String(n));
  }
  return (
    <form onSubmit={(e) => void submit(e)} className="card space-y-2" aria-labelledby="walk-in-heading" noValidate>
      <h2 id="walk-in-heading" className="text-xl">
        Walk-in
      </h2>
      <label htmlFor="walk-in-number" className="field-label">
        Race number
      </label>
      <input
        id="walk-in-number"
        className="field-input min-h-touch"
        inputMode="numeric"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? 'walk-in-error' : undefined}
      />
      {error && (
        <p id="walk-in-error" className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary min-h-touch">
        Check in a walk-in
      </button>
    </form>
  );
}
