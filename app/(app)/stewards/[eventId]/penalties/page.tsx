import type { Metadata } from 'next';
import Link from '@/components/link';
import { getPenaltyDesk } from '@/lib/server/penalties/penalty-desk';
import { GOVERNING_BODY_CAUTION, PENALTY_KIND_LABELS } from '@/lib/core/penalties/penalty-kinds';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { SafetyNote } from '@/components/safety-note';
import { openPenalties } from '../access';
import { ImposePenaltyForm } from './impose-penalty-form';

export const metadata: Metadata = { title: 'Penalties' };
export const dynamic = 'force-dynamic';

const STATE_LABELS = { in_force: 'In force', annulled: 'Annulled on appeal', replaced: 'Replaced on appeal' } as const;

export default async function PenaltiesPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openPenalties(params);
  const desk = await getPenaltyDesk(actor, eventId);
  const zone = event.timeZone;
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/stewards">Stewards</Link> / <Link href={`/stewards/${eventId}`}>{event.name}</Link> / Penalties
      </nav>
      <h1>Penalties at {event.name}</h1>
      <SafetyNote />
      <p className="text-sm text-ink-soft" data-testid="governing-body-caution">
        {GOVERNING_BODY_CAUTION}
      </p>
      <p>
        A penalty amends the class&apos;s results as a new version, with its reason beside the boat&apos;s row, and the
        entrant is told by e-mail. A party may give notice of appeal to the governing body&apos;s appeal body.
      </p>

      <section aria-labelledby="reports" className="space-y-2">
        <h2 id="reports">Technical reports to the stewards ({desk.reports.length})</h2>
        {desk.reports.length === 0 && <p className="text-ink-soft">No reports.</p>}
        <ul className="space-y-2">
          {desk.reports.map((r) => (
            <li key={r.id} className="card" data-report-id={r.id}>
              <p className="font-bold">
                #{r.raceNumber} {r.boatName}: {r.ruleReference}
              </p>
              <p className="whitespace-pre-line">{r.facts}</p>
              <p className="text-sm text-ink-soft">
                by {r.filedByName}, {formatInZone(r.createdAt, zone)}
                {r.penaltyIds.length ? ` · ${r.penaltyIds.length} penalty decided` : ' · not decided yet'}
              </p>
            </li>
          ))}
        </ul>
      </section>

      {desk.catalogue.length === 0 ? (
        <p className="card">The organiser has not set up this meeting&apos;s penalty catalogue yet.</p>
      ) : (
        <ImposePenaltyForm
          eventId={eventId}
          entries={Object.fromEntries(
            desk.entries.map((e) => [e.id, `#${e.raceNumber} ${e.boatName} (${e.classCode})`]),
          )}
          catalogue={Object.fromEntries(
            desk.catalogue.map((i) => [
              i.id,
              `${i.code}: ${i.label} (${PENALTY_KIND_LABELS[i.kind]}${i.amount ? `, ${i.amount}` : ''})`,
            ]),
          )}
          reports={Object.fromEntries(desk.reports.map((r) => [r.id, `#${r.raceNumber}: ${r.ruleReference}`]))}
          protests={Object.fromEntries(desk.upheldProtests.map((p) => [p.id, p.label]))}
        />
      )}

      <section aria-labelledby="decided" className="space-y-2">
        <h2 id="decided">Penalties decided ({desk.penalties.length})</h2>
        {desk.penalties.length === 0 && <p className="text-ink-soft">No penalties.</p>}
        <table className="w-full text-left text-sm" data-testid="penalties-table">
          <thead className="bg-paper-deep">
            <tr>
              <th className="p-2">Boat</th>
              <th className="p-2">Penalty</th>
              <th className="p-2">Reason</th>
              <th className="p-2">Decided</th>
              <th className="p-2">State</th>
            </tr>
          </thead>
          <tbody>
            {desk.penalties.map((p) => (
              <tr key={p.id} className="border-t border-paper-line">
                <td className="p-2">
                  #{p.raceNumber} {p.boatName}
                </td>
                <td className="p-2">
                  {p.code} {p.label}
                  {p.runLabel && ` (run ${p.runLabel})`}
                  {p.appealId && <span className="block text-xs">set by the appeal body</span>}
                </td>
                <td className="p-2">{p.reason}</td>
                <td className="p-2">
                  {formatInZone(p.decidedAt, zone)} by {p.decidedByName}
                  <span className="block text-xs text-ink-soft">
                    notice of appeal by {formatInZone(p.appealDeadline, zone)}
                  </span>
                </td>
                <td className="p-2 font-bold">
                  {STATE_LABELS[p.state]}
                  {p.appealPending && <span className="block text-doubt-800">Under appeal</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}
