import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { DecisionCaution, ProtestStatusBadge } from '../../../../protests/protest-badges';
import { EvidenceList } from '../../../../protests/evidence-list';
import { ProtestFacts } from '../../../../protests/protest-facts';
import { EvidenceForm } from '../../../../protests/[protestId]/evidence-form';
import { openStewardProtest } from '../../access';
import { StewardActions } from './steward-actions';
import { ConflictNotice } from './conflict-notice';
import { listCustodyForProtest } from '@/lib/server/custody/manage-custody';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { BURDEN_WORDS, OUTCOME_WORDS } from '@/lib/core/engine/conformity-burden';

export const metadata: Metadata = { title: 'Protest (stewards)' };
export const dynamic = 'force-dynamic';

export default async function StewardProtestPage({
  params,
}: {
  params: Promise<{ eventId: string; protestId: string }>;
}) {
  const { actor, eventId, protest: p } = await openStewardProtest(params);
  const parts = can(actor, 'custody.view', { eventId }) ? await listCustodyForProtest(actor, eventId, p.id) : [];
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/stewards">Stewards</Link> / <Link href={`/stewards/${eventId}`}>{p.eventName}</Link> /{' '}
        {p.targetLabel}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Protest against {p.targetLabel}</h1>
        <ProtestStatusBadge status={p.status} />
      </div>
      {p.paidAt && p.paidAt > p.windowDeadline && (
        <p role="note" className="rounded-lg bg-doubt-100 p-3 text-doubt-800">
          The fee was paid after the window closed ({p.windowDeadlineLabel}).
        </p>
      )}
      <ConflictNotice p={p} />
      <StewardActions p={p} />
      <ProtestFacts p={p} />
      <section aria-labelledby="evidence" className="card space-y-4">
        <h2 id="evidence">Evidence</h2>
        <EvidenceList evidence={p.evidence} timeZone={p.timeZone} />
        {p.can.addEvidence && <EvidenceForm protestId={p.id} />}
      </section>
      <section aria-labelledby="reinspections" className="card space-y-2">
        <h2 id="reinspections">Re-inspections ordered</h2>
        <p className="text-ink-soft" data-testid="protest-burden-note">
          In a protest the protester must prove non-conformity (ISO 14253-1:2017; ILAC-G8:09/2019) unless the class
          rules say otherwise: a re-check recorded as a protest inspection with an inconclusive result means
          non-conformity is not proven and the part stands. Each result below says which burden applied; the stewards
          decide.
        </p>
        {p.reinspections.length === 0 ? (
          <p>None.</p>
        ) : (
          <ul data-testid="reinspections">
            {p.reinspections.map((t) => (
              <li key={t.id} data-reinspection-id={t.id}>
                {t.reason} —{' '}
                {t.inspectionId ? (
                  <>
                    recorded: <strong>{t.verdict?.replace(/_/g, ' ') ?? 'no verdict'}</strong>
                    {t.burdenOfProof && t.outcome && (
                      <span data-testid="reinspection-outcome" data-outcome={t.outcome}>
                        {' '}
                        — <strong>{OUTCOME_WORDS[t.outcome]}</strong> ({BURDEN_WORDS[t.burdenOfProof]})
                      </span>
                    )}
                    {t.doneAt ? ` (${formatInZone(new Date(t.doneAt), p.timeZone)})` : ''} —{' '}
                    <Link href={`/stewards/${p.eventId}/audit?kind=inspection`}>see it in the audit trail</Link>
                  </>
                ) : (
                  'waiting for the scrutineers'
                )}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="custody" className="card space-y-2">
        <h2 id="custody">Parts kept for this protest</h2>
        {parts.length === 0 ? (
          <p>
            None. Parts are taken into custody on the <Link href={`/inspect/${eventId}/custody`}>custody page</Link>.
          </p>
        ) : (
          <ul className="space-y-1" data-testid="protest-custody">
            {parts.map((i) => (
              <li key={i.id}>
                {i.description}
                {i.sealNumber && ` (seal/bag ${i.sealNumber})`}, no. {i.raceNumber}, taken by {i.takenBy}{' '}
                {formatInZone(i.takenAt, p.timeZone)}
                {i.release ? ` — released to ${i.release.releasedTo}` : ' — held'}
              </li>
            ))}
          </ul>
        )}
      </section>
      <DecisionCaution />
    </div>
  );
}
