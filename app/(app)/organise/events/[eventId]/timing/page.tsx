import type { Metadata } from 'next';
import Link from '@/components/link';
import { listRunTimes } from '@/lib/server/timing/list-run-times';
import { SafetyNote } from '@/components/safety-note';
import { figureValue } from '@/lib/core/format/figures';
import { openResults } from '../access';
import { RunTimesImport } from './run-times-import';
import { RunTimesEntryForm } from './run-times-entry-form';

export const metadata: Metadata = { title: 'Run times' };
export const dynamic = 'force-dynamic';

const kmh = (ms: number | null) => (ms === null ? '—' : figureValue(ms * 3.6, 'speedKmh'));

export default async function TimingPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId } = await openResults(params);
  const classes = await listRunTimes(actor, eventId);
  const options = classes.map((c) => ({ classId: c.classId, label: `${c.classCode} · ${c.className}` }));
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>Meeting</Link> / Run times
      </nav>
      <h1>Run times</h1>
      <p>
        Runs from the timing sheet, per class. Nothing is ever changed: a run imported again with the same figures is
        skipped, and one with other figures is stored as a correction that supersedes it. Compare them with the model on{' '}
        <Link href={`/organise/events/${eventId}/clock`}>Model against the clock</Link>.
      </p>
      <div className="grid gap-4 lg:grid-cols-2">
        <RunTimesImport eventId={eventId} classes={options} />
        <RunTimesEntryForm eventId={eventId} classes={options} />
      </div>
      {classes.map((c) => (
        <section
          key={c.classId}
          aria-labelledby={`runs-${c.classId}`}
          className="card space-y-3"
          data-class={c.classCode}
        >
          <h2 id={`runs-${c.classId}`}>
            {c.classCode} · {c.className}
          </h2>
          {c.runs.length === 0 ? (
            <p className="text-ink-soft">No run times stored.</p>
          ) : (
            <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`Run times of ${c.classCode}`}>
              <table className="w-full text-left text-sm" data-testid="runs-table">
                <thead className="bg-paper-deep">
                  <tr>
                    <th className="p-2">No.</th>
                    <th className="p-2">Boat</th>
                    <th className="p-2">Run</th>
                    <th className="p-2">Course (m)</th>
                    <th className="p-2">Time (s)</th>
                    <th className="p-2">Trap (km/h)</th>
                    <th className="p-2">GPS top (km/h)</th>
                    <th className="p-2">rpm</th>
                    <th className="p-2">Conditions</th>
                  </tr>
                </thead>
                <tbody>
                  {c.runs.map((r) => (
                    <tr key={r.id} className="border-t border-paper-line">
                      <td className="figure p-2">{r.raceNumber}</td>
                      <td className="p-2">{r.boatName}</td>
                      <td className="p-2">
                        {r.runLabel}
                        {r.isCorrection && <span className="ml-1 text-xs font-bold">(corrected)</span>}
                      </td>
                      <td className="figure p-2">{r.courseLengthM}</td>
                      <td className="figure p-2">{r.elapsedS.toFixed(3)}</td>
                      <td className="figure p-2">{kmh(r.trapSpeedMs)}</td>
                      <td className="figure p-2">{kmh(r.gpsTopSpeedMs)}</td>
                      <td className="figure p-2">{r.rpm ?? '—'}</td>
                      <td className="p-2">{r.conditions}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </section>
      ))}
      <SafetyNote />
    </div>
  );
}
