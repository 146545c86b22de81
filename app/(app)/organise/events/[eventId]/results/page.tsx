import type { Metadata } from 'next';
import Link from '@/components/link';
import { listProvisionalResults } from '@/lib/server/results/list-provisional-results';
import { SafetyNote } from '@/components/safety-note';
import { GOVERNING_BODY_CAUTION } from '@/lib/core/penalties/penalty-kinds';
import { openResults } from '../access';
import { ResultsForm } from './results-form';
import { CheckpointCard } from '@/components/checkpoint-card';
import { resultsCheckpoint } from '@/lib/server/chain/chain-service';
import { getDb } from '@/lib/server/db';

export const metadata: Metadata = { title: 'Provisional results' };

const SOURCE_LABELS = {
  form: 'form',
  csv: 'CSV upload',
  stewards: "stewards' penalties applied",
  appeal: "appeal body's decision applied",
} as const;
const STATUS_LABELS = { dsq: 'DSQ', excluded: 'EXC' } as const;
export const dynamic = 'force-dynamic';

export default async function ResultsPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId } = await openResults(params);
  const classes = await listProvisionalResults(actor, eventId);
  // Each class's latest version with the signed checkpoint that covers it (signed just after publication, so a
  // version published a moment ago may not have one yet).
  const [event, checkpoints] = await Promise.all([
    getDb().models.Event.findByPk(eventId, { attributes: ['timeZone'] }),
    Promise.all(classes.map((c) => (c.latest ? resultsCheckpoint(eventId, c.latest.id) : null))),
  ]);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>Meeting</Link> / Provisional
        results
      </nav>
      <h1>Provisional results</h1>
      <p>
        Each publication is a numbered version that is never changed. It opens the protest window for every boat whose
        place it changed; the others keep their deadline. A stewards&apos; penalty, or the appeal body&apos;s decision
        on one, makes a new version from your latest with the penalties in force applied, the reason beside the row.
      </p>
      <p className="text-sm text-ink-soft">{GOVERNING_BODY_CAUTION}</p>
      <ResultsForm
        eventId={eventId}
        classes={classes.map((c) => ({ classId: c.classId, label: `${c.classCode} · ${c.className}` }))}
      />
      {classes.map((c, i) => (
        <section
          key={c.classId}
          aria-labelledby={`class-${c.classId}`}
          className="card space-y-3"
          data-class={c.classCode}
        >
          <h2 id={`class-${c.classId}`}>
            {c.classCode} · {c.className}
          </h2>
          {!c.latest ? (
            <p className="text-ink-soft">No results published.</p>
          ) : (
            <>
              <p>
                Version {c.latest.version} of {c.versionCount}, published {c.latest.publishedAtLabel} (
                {SOURCE_LABELS[c.latest.source]}){c.latest.note && ` — ${c.latest.note}`}.
              </p>
              <p
                className={`font-bold ${c.latest.window.isOpen ? 'text-doubt-800' : 'text-ink-soft'}`}
                data-testid="results-window"
              >
                {c.latest.window.isOpen
                  ? `Protest window open until ${c.latest.window.deadlineLabel}`
                  : `Protest window closed at ${c.latest.window.deadlineLabel}`}{' '}
                for the boats this version changed.
              </p>
              <table className="w-full text-left text-sm" data-testid="results-table">
                <thead className="bg-paper-deep">
                  <tr>
                    <th className="p-2">Pos.</th>
                    <th className="p-2">No.</th>
                    <th className="p-2">Boat</th>
                    <th className="p-2">Best time</th>
                    <th className="p-2">Protests until</th>
                  </tr>
                </thead>
                <tbody>
                  {c.latest.rows.map((r) => (
                    <tr key={r.entryId} className="border-t border-paper-line">
                      <td className="figure p-2 font-bold">{r.status ? STATUS_LABELS[r.status] : r.position}</td>
                      <td className="figure p-2">{r.raceNumber}</td>
                      <td className="p-2">
                        {r.boatName}
                        {r.isChanged && c.latest!.version > 1 && (
                          <span className="ml-1 text-xs font-bold">(changed)</span>
                        )}
                        {r.underAppeal && (
                          <span className="ml-1 text-xs font-bold text-doubt-800" data-testid="under-appeal">
                            Under appeal
                          </span>
                        )}
                        {r.amendments.map((a) => (
                          <span key={a.penaltyId} className="block text-xs" data-testid="amendment">
                            {a.byAppeal ? 'Appeal body' : 'Stewards'}: {a.code} {a.label} — {a.reason}
                          </span>
                        ))}
                      </td>
                      <td className="figure p-2" data-testid="best-time">
                        {r.bestRun ? (
                          <>
                            {`${r.bestRun.elapsedS.toFixed(2)} s`}
                            <span className="block text-xs text-ink-soft">
                              {`${r.bestRun.courseLengthM} m, run ${r.bestRun.runLabel} of ${r.bestRun.runs}`}
                            </span>
                          </>
                        ) : (
                          '—'
                        )}
                      </td>
                      <td className="p-2">
                        {r.window.deadlineLabel}
                        {!r.window.isOpen && ' (closed)'}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {checkpoints[i] && (
                <CheckpointCard
                  checkpoint={checkpoints[i]}
                  timeZone={event?.timeZone ?? 'UTC'}
                  testId="results-checkpoint"
                  headingId={`checkpoint-${c.classId}`}
                />
              )}
            </>
          )}
        </section>
      ))}
      <SafetyNote />
    </div>
  );
}
