'use client';

import Link from '@/components/link';
import { useCallback, useEffect, useState } from 'react';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import type { InspectionBoard } from '@/lib/server/inspections/list-inspection-board';
import { SafetyNote } from '@/components/safety-note';
import { VerdictBadge } from '@/components/verdict-badge';
import { FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { TopFinishersPicker } from './top-finishers-picker';
import { formatOnDevice } from '@/lib/core/format/device-time';

const REFRESH_MS = 10_000;
const RESULTS = [
  ['', 'Any result'],
  ['waiting', 'Waiting (not inspected)'],
  ['does_not_conform', 'Does not conform'],
  ['inconclusive', 'Inconclusive'],
  ['conforms', 'Conforms'],
  ['reinspection', 'Re-inspection asked'],
] as const;

/** The board: fetched in the browser every 10 s; class and result filters live in the URL. */
export function BoardView({
  eventId,
  canAssign,
  canRecord,
  canOpenLogbook,
}: {
  eventId: string;
  canAssign: boolean;
  canRecord: boolean;
  /** Officials with entry.view_all may open a boat's logbook from its row. */
  canOpenLogbook: boolean;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const classFilter = params.get('class') ?? '';
  const result = params.get('result') ?? '';
  const [board, setBoard] = useState<InspectionBoard | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  const [reason, setReason] = useState('');

  const setParam = (k: string, v: string) => {
    const next = new URLSearchParams(params);
    if (v) next.set(k, v);
    else next.delete(k);
    router.replace(`${pathname}?${next.toString()}`, { scroll: false });
  };

  const load = useCallback(async () => {
    const q = new URLSearchParams();
    if (classFilter) q.set('class', classFilter);
    if (result) q.set('result', result);
    const answer = await requestJson<InspectionBoard>(`/api/events/${eventId}/inspections?${q}`, {
      method: 'GET',
      cache: 'no-store',
      fallbackMessage: (status) => `The board could not be loaded (${status}).`,
    });
    if (answer.status === 0) return setError('No connection: the board will refresh when the signal returns.');
    if (!answer.ok) return setError(answer.message);
    setBoard(answer.data);
    setError(
      answer.headers.get('X-Served-From') === 'cache' ? 'No signal: showing the last board this phone saw.' : null,
    );
  }, [eventId, classFilter, result]);

  useEffect(() => {
    const run = () => void load();
    const first = window.setTimeout(run, 0);
    const timer = window.setInterval(run, REFRESH_MS);
    return () => {
      window.clearTimeout(first);
      window.clearInterval(timer);
    };
  }, [load]);

  const request = useFormAction(
    async (): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/reinspections`, {
        body: { entryIds: [...chosen], reason },
        fallbackMessage: 'The request failed.',
      });
      // The request's fields are the boats chosen and the reason: the first refusal says which.
      if (!answer.ok) return { ok: false, message: Object.values(answer.fieldErrors)[0] ?? answer.message };
      const message = `Re-inspection asked for ${chosen.size} boat${chosen.size === 1 ? '' : 's'}.`;
      setChosen(new Set());
      setReason('');
      void load();
      return { ok: true, message };
    },
    { ok: false },
  );

  const c = board?.counts;
  const countButton = (value: string, label: string, n: number | undefined, tone: string) => (
    <button
      type="button"
      onClick={() => setParam('result', result === value ? '' : value)}
      aria-pressed={result === value}
      className={`min-h-touch rounded-lg border-2 px-3 py-2 text-left text-lg font-bold ${tone}`}
      data-testid={`count-${value}`}
    >
      <span className="figure block text-3xl">{n ?? '–'}</span>
      {label}
    </button>
  );

  return (
    <div className="space-y-4 text-lg" data-testid="inspection-board">
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {countButton('waiting', 'Waiting', c?.waiting, 'border-ink-mute bg-white')}
        {countButton(
          'does_not_conform',
          '✕ Does not conform',
          c?.doesNotConform,
          'border-fail-600 bg-fail-100 text-fail-800',
        )}
        {countButton('inconclusive', '? Inconclusive', c?.inconclusive, 'border-doubt-600 bg-doubt-100 text-doubt-800')}
        {countButton('reinspection', 'Re-inspections open', c?.openReinspections, 'border-flare-500 bg-flare-100')}
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="board-class" className="field-label text-lg">
            Class
          </label>
          <select
            id="board-class"
            className="field-input min-h-touch text-xl"
            value={classFilter}
            onChange={(e) => setParam('class', e.target.value)}
          >
            <option value="">All classes</option>
            {board?.classes.map((k) => (
              <option key={k.id} value={k.code}>
                {k.code} {k.name}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="board-result" className="field-label text-lg">
            Result
          </label>
          <select
            id="board-result"
            className="field-input min-h-touch text-xl"
            value={result}
            onChange={(e) => setParam('result', e.target.value)}
          >
            {RESULTS.map(([v, l]) => (
              <option key={v} value={v}>
                {l}
              </option>
            ))}
          </select>
        </div>
      </div>
      <p role="status" aria-live="polite" className="text-ink-soft" data-testid="board-status">
        {error ??
          (board
            ? `${board.rows.length} of ${c?.total} boats shown · ${c?.conforms} conform · updated ${new Date(board.generatedAt).toLocaleTimeString()}`
            : 'Loading…')}
      </p>

      {board && board.reinspections.length > 0 && (
        <section className="card space-y-2" aria-labelledby="reinspect-heading">
          <h2 id="reinspect-heading" className="text-xl">
            Re-inspections to work through ({board.reinspections.length})
          </h2>
          <ol className="list-decimal space-y-2 pl-6" data-testid="reinspection-list">
            {board.reinspections.map((t) => (
              <li key={t.id}>
                <span className="figure font-bold">No. {t.raceNumber}</span> {t.boatName} ({t.classCode}): {t.reason}
                <span className="block text-ink-soft">asked by {t.requestedBy}</span>
                {canRecord && (
                  <Link href={`/inspect/${eventId}?race=${t.raceNumber}`} className="btn-secondary mt-1 text-lg">
                    Inspect now
                  </Link>
                )}
              </li>
            ))}
          </ol>
        </section>
      )}

      <ul className="space-y-2" data-testid="board-rows">
        {board?.rows.map((r) => (
          <li
            key={r.entryId}
            className="card flex flex-wrap items-center justify-between gap-3 p-4"
            data-state={r.state}
            data-race-number={r.raceNumber}
          >
            <div className="flex items-center gap-3">
              {canAssign && (
                <label className="flex min-h-touch min-w-touch cursor-pointer items-center justify-center">
                  <input
                    type="checkbox"
                    className="h-7 w-7 accent-tide-600"
                    aria-label={`Choose no. ${r.raceNumber} for re-inspection`}
                    checked={chosen.has(r.entryId)}
                    onChange={(e) =>
                      setChosen((s) => {
                        const n = new Set(s);
                        if (e.target.checked) n.add(r.entryId);
                        else n.delete(r.entryId);
                        return n;
                      })
                    }
                  />
                </label>
              )}
              <div>
                <p>
                  <span className="figure text-2xl font-bold">{r.raceNumber}</span>{' '}
                  <span className="font-bold">{r.boatName}</span> · {r.classCode}
                  {canOpenLogbook && (
                    <Link href={`/boats/${r.boatId}/logbook`} className="ml-2 text-base">
                      Logbook
                    </Link>
                  )}
                </p>
                <p className="text-ink-soft">
                  {r.latest
                    ? `by ${r.latest.recordedBy} at ${formatOnDevice(r.latest.capturedAt, 'time')}`
                    : r.declarationChange
                      ? 'inspected at an earlier declaration'
                      : 'not inspected yet'}
                  {r.openReinspectionCount > 0 ? ' · re-inspection asked' : ''}
                  {r.isPaid ? '' : ' · not paid'}
                </p>
                {r.declarationChange && (
                  <p
                    className="mt-1 rounded-lg border-2 border-flare-500 bg-flare-100 p-2 font-bold"
                    data-testid="declaration-change"
                  >
                    {r.declarationChange}
                  </p>
                )}
              </div>
            </div>
            <VerdictBadge verdict={r.declarationChange ? 'reinspection_required' : r.state} />
          </li>
        ))}
        {board && board.rows.length === 0 && <li className="card">No boats match.</li>}
      </ul>

      {canAssign && (
        <section className="card space-y-3" aria-labelledby="request-heading">
          <h2 id="request-heading" className="text-xl">
            Ask for re-inspection ({chosen.size} chosen)
          </h2>
          <TopFinishersPicker
            eventId={eventId}
            onPick={(ids, why) => {
              setChosen((prev) => new Set([...prev, ...ids]));
              setReason((r) => r || why);
            }}
          />
          <form {...request.form} className="space-y-3">
            <label htmlFor="reinspect-reason" className="field-label text-lg">
              Why (for example “top three, final”)
            </label>
            <input
              id="reinspect-reason"
              className="field-input min-h-touch text-xl"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
            <FormMessage state={request.state} testId="reinspection-request-message" />
            <button type="submit" className="btn-primary text-lg" disabled={chosen.size === 0 || request.isPending}>
              Ask for re-inspection
            </button>
          </form>
        </section>
      )}
      <SafetyNote className="text-lg" />
    </div>
  );
}
