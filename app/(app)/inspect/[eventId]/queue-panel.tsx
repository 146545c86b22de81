'use client';

import type { QueuedRecord } from '@/app/(app)/inspect/[eventId]/offline-queue';
import { VerdictBadge } from '@/components/verdict-badge';
import { formatOnDevice } from '@/lib/core/format/device-time';

const time = (iso: string | null) => (iso ? formatOnDevice(iso, 'time') : '');

type Props = {
  records: QueuedRecord[];
  actorId: string;
  isOnline: boolean;
  onSendNow: () => void;
  onFix: (r: QueuedRecord) => void;
  onRemove: (r: QueuedRecord) => void;
};

/** What this phone still has to send, what the server refused, and what arrived. */
export function QueuePanel({ records, actorId, isOnline, onSendNow, onFix, onRemove }: Props) {
  const waiting = records.filter((r) => r.state === 'waiting');
  const needsFix = records.filter((r) => r.state === 'needs_fix');
  const sentAll = records.filter((r) => r.state === 'sent');
  const sent = sentAll.slice(-10).reverse(); // the newest ten; the count is of all
  return (
    <section aria-label="Records on this phone" className="card space-y-4 text-lg" data-testid="queue">
      <p className={`font-bold ${isOnline ? 'text-pass-800' : 'text-fail-800'}`} data-testid="connection" role="status">
        {isOnline ? '● Online' : '○ Offline: records are kept on this phone and sent when the signal returns.'}
      </p>
      <div>
        <h2 className="text-xl" data-testid="waiting-heading">
          Waiting to send ({waiting.length})
        </h2>
        {waiting.length > 0 && (
          <>
            <ul className="mt-2 space-y-1" data-testid="waiting-list">
              {waiting.map((r) => (
                <li key={r.idempotencyKey}>
                  {r.label} · {time(r.createdAt)}
                  {r.inspectionId ? ' · photos pending' : ''}
                  {r.recordedById !== actorId && (
                    <span className="block font-bold">
                      Recorded by another person on this phone: it is sent when they sign in here.
                    </span>
                  )}
                  {r.message ? <span className="block text-ink-soft">{r.message}</span> : null}
                </li>
              ))}
            </ul>
            <button type="button" className="btn-secondary mt-2 text-lg" onClick={onSendNow} disabled={!isOnline}>
              Send now
            </button>
          </>
        )}
      </div>
      {needsFix.length > 0 && (
        <div className="rounded-lg border-2 border-fail-600 bg-fail-100 p-3">
          <h2 className="text-xl text-fail-800" data-testid="needs-fix-heading">
            Needs a fix ({needsFix.length})
          </h2>
          <ul className="mt-2 space-y-3" data-testid="needs-fix-list">
            {needsFix.map((r) => (
              <li key={r.idempotencyKey}>
                <span className="font-bold">{r.label}</span>
                <span className="block">{r.message}</span>
                <span className="mt-1 flex flex-wrap gap-2">
                  {!r.inspectionId && (
                    <button type="button" className="btn-primary text-lg" onClick={() => onFix(r)}>
                      Fix and send again
                    </button>
                  )}
                  <button
                    type="button"
                    className="btn-secondary text-lg"
                    onClick={() => {
                      if (window.confirm(`Remove ${r.label} from this phone? It was not recorded.`)) onRemove(r);
                    }}
                  >
                    Remove from this phone
                  </button>
                </span>
              </li>
            ))}
          </ul>
        </div>
      )}
      <div>
        <h2 className="text-xl" data-testid="sent-heading">
          Sent ({sentAll.length})
        </h2>
        <ul className="mt-2 space-y-2" data-testid="sent-list">
          {sent.map((r) => (
            <li
              key={r.idempotencyKey}
              className="flex flex-wrap items-center justify-between gap-2"
              data-key={r.idempotencyKey}
            >
              <span>
                {r.label} · {time(r.sentAt)}
              </span>
              {r.overallResult && <VerdictBadge verdict={r.overallResult} />}
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}
