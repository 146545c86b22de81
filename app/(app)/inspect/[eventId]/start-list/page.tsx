import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { loadStartList } from '@/lib/server/start-list/start-list';
import { formatCalendarDate, formatTime } from '@/lib/core/format/time';
import { openStartList } from '../access';
import { StartDecisionForm } from './start-decision-form';

export const metadata: Metadata = { title: 'Start list' };
export const dynamic = 'force-dynamic';

// No pass, no start: who may start on a meeting day, each held boat with every reason, printable and
// as CSV for the timing system. The organiser's recorded decisions show beside the rows they settle.
export default async function StartListPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<{ day?: string; class?: string }>;
}) {
  const { actor, eventId, event } = await openStartList(params);
  const q = await searchParams;
  const list = await loadStartList(actor, eventId, { day: q.day ?? null, classFilter: q.class ?? null });
  const canDecide = can(actor, 'start_list.decide', { eventId });
  const query = (over: Record<string, string | null>) => {
    const p = new URLSearchParams({ day: list.day, ...(list.classId ? { class: list.classId } : {}) });
    for (const [k, v] of Object.entries(over))
      if (v === null) p.delete(k);
      else p.set(k, v);
    return p.toString();
  };
  const dayLabel = formatCalendarDate(list.day);
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg print:hidden">
        <Link href="/inspect">Inspect</Link> / {event.name} / Start list
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Start list, {dayLabel}</h1>
        <div className="flex flex-wrap gap-2 print:hidden">
          <a
            href={`/api/events/${eventId}/start-list?${query({ format: 'csv' })}`}
            className="btn-secondary text-lg"
            download
          >
            CSV for the timing system
          </a>
          <Link href={`/inspect/${eventId}/board`} className="btn-secondary text-lg">
            Inspection board
          </Link>
        </div>
      </div>
      <p className="text-base">
        <strong>{list.counts.mayStart}</strong> of {list.counts.total} may start; <strong>{list.counts.held}</strong>{' '}
        held{list.counts.byOrganiser ? `; ${list.counts.byOrganiser} settled by the organiser` : ''}. State at{' '}
        {formatTime(list.generatedAt, list.timeZone)}: reload before the start.
      </p>
      <p className="rounded-lg bg-tide-50 p-3 text-base text-tide-700">
        Safety first: this list carries the officials’ checks; it never replaces them. The governing body’s rules, local
        regulations and licensed officials decide who starts.
      </p>
      <nav aria-label="Days and classes" className="flex flex-wrap gap-2 text-base print:hidden">
        {list.days.map((d) => (
          <Link
            key={d}
            href={`?${query({ day: d })}`}
            aria-current={d === list.day ? 'page' : undefined}
            className={d === list.day ? 'font-bold' : ''}
          >
            {formatCalendarDate(d)}
          </Link>
        ))}
        <span aria-hidden="true">·</span>
        <Link
          href={`?${query({ class: null })}`}
          aria-current={!list.classId ? 'page' : undefined}
          className={!list.classId ? 'font-bold' : ''}
        >
          All classes
        </Link>
        {list.classes.map((c) => (
          <Link
            key={c.id}
            href={`?${query({ class: c.id })}`}
            aria-current={list.classId === c.id ? 'page' : undefined}
            className={list.classId === c.id ? 'font-bold' : ''}
          >
            {c.code}
          </Link>
        ))}
      </nav>
      {list.rows.length === 0 ? (
        <p>No live entries{list.classId ? ' in this class' : ''}.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-base" data-testid="start-list">
            <caption className="sr-only">Start list for {dayLabel}</caption>
            <thead>
              <tr className="text-left">
                <th scope="col">No.</th>
                <th scope="col">Boat</th>
                <th scope="col">Class</th>
                <th scope="col">May start</th>
                <th scope="col">Why not / decision</th>
              </tr>
            </thead>
            <tbody>
              {list.rows.map((r) => (
                <tr
                  key={r.entryId}
                  className="border-t border-paper-line align-top"
                  data-race={r.raceNumber}
                  data-may-start={r.verdict.mayStart ? 'yes' : 'no'}
                >
                  <td className="font-bold">{r.raceNumber}</td>
                  <td>
                    {r.boatName}
                    <span className="block text-sm text-ink-soft">{r.entrant}</span>
                  </td>
                  <td>{r.classCode}</td>
                  <td className={r.verdict.mayStart ? 'font-bold text-pass-800' : 'font-bold text-fail-800'}>
                    {r.verdict.mayStart ? 'Yes' : 'No'}
                  </td>
                  <td>
                    {r.verdict.holds.length > 0 && (
                      <ul className="list-disc pl-5">
                        {r.verdict.holds.map((h) => (
                          <li key={h}>{h}</li>
                        ))}
                      </ul>
                    )}
                    {r.verdict.decision && (
                      <p className="text-sm">
                        Organiser: {r.verdict.decision.mayStart ? 'may start' : 'held'}, “{r.verdict.decision.reason}” (
                        {r.verdict.decision.decidedBy}, {formatTime(r.verdict.decision.decidedAt, list.timeZone)})
                      </p>
                    )}
                    {r.verdict.newSinceDecision.length > 0 && (
                      <p className="text-sm font-bold">
                        New since the organiser’s decision, so held again: {r.verdict.newSinceDecision.join(' ')}
                      </p>
                    )}
                    {r.verdict.basis === 'clear' && <span className="text-ink-soft">Nothing holds it.</span>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {canDecide && list.rows.length > 0 && (
        <StartDecisionForm
          eventId={eventId}
          day={list.day}
          entries={list.rows.map((r) => ({
            id: r.entryId,
            label: `No. ${r.raceNumber} ${r.boatName} (${r.verdict.mayStart ? 'may start' : 'held'})`,
          }))}
        />
      )}
    </div>
  );
}
