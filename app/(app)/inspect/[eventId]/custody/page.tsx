import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { openCustody } from '../access';
import { listCustody, listProtestsToKeepPartsFor } from '@/lib/server/custody/manage-custody';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { PROTEST_STATUS_LABELS, OPEN_STATUSES, type ProtestStatus } from '@/lib/core/protests/protest-states';
import { SafetyNote } from '@/components/safety-note';
import { ReleaseForm, TakeIntoCustodyForm } from './custody-forms';

export const metadata: Metadata = { title: 'Parts in custody' };
export const dynamic = 'force-dynamic';

// Parts the officials hold at the meeting: taken at the dock, released once nothing is pending.
export default async function CustodyPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openCustody(params);
  const [items, protests] = await Promise.all([
    listCustody(actor, eventId),
    listProtestsToKeepPartsFor(actor, eventId),
  ]);
  const canTake = can(actor, 'custody.take', { eventId });
  const canRelease = can(actor, 'custody.release', { eventId });
  const held = items.filter((i) => !i.release);
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        {can(actor, 'inspection.board', { eventId }) || can(actor, 'inspection.record', { eventId }) ? (
          <>
            <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}/board`}>{event.name}</Link>
          </>
        ) : (
          <>
            <Link href="/stewards">Stewards</Link> / <Link href={`/stewards/${eventId}`}>{event.name}</Link>
          </>
        )}{' '}
        / Parts in custody
      </nav>
      <h1>Parts in custody</h1>
      <p className="text-ink-soft">
        Parts removed from boats and held by the officials, usually in a sealed bag, until nothing is pending. Records
        are never edited: a release is a second record.
      </p>
      {canTake && <TakeIntoCustodyForm eventId={eventId} protests={protests} />}
      <section aria-labelledby="held-heading" className="space-y-3">
        <h2 id="held-heading" className="text-xl">
          Held now ({held.length})
        </h2>
        {items.length === 0 && (
          <p className="card text-ink-soft">No parts have been taken into custody at this meeting.</p>
        )}
        <ul className="space-y-3" data-testid="custody-list">
          {items.map((i) => (
            <li
              key={i.id}
              className={`card space-y-1 ${i.release ? 'opacity-80' : ''}`}
              data-item={i.id}
              data-held={i.release ? 'no' : 'yes'}
            >
              <p className="font-bold">
                <span className="figure">no. {i.raceNumber}</span> {i.boatName} · {i.classCode}
              </p>
              <p>
                {i.description}
                {i.sealNumber && (
                  <>
                    {' '}
                    · seal/bag <span className="figure">{i.sealNumber}</span>
                  </>
                )}
              </p>
              <p className="text-base text-ink-soft">
                Taken by {i.takenBy}, {formatInZone(i.takenAt, event.timeZone)}
              </p>
              {i.protest && (
                <p className="text-base">
                  Kept for the protest under {i.protest.ruleReference} (
                  {PROTEST_STATUS_LABELS[i.protest.status as ProtestStatus].toLowerCase()})
                </p>
              )}
              {i.release ? (
                <p className="rounded-lg bg-paper-deep px-3 py-2 text-base" data-testid="released">
                  Released to {i.release.releasedTo} by {i.release.releasedBy},{' '}
                  {formatInZone(i.release.releasedAt, event.timeZone)}
                  {i.release.note && `: ${i.release.note}`}
                </p>
              ) : (
                canRelease && (
                  <ReleaseForm
                    eventId={eventId}
                    itemId={i.id}
                    pendingProtest={Boolean(i.protest && OPEN_STATUSES.includes(i.protest.status as ProtestStatus))}
                  />
                )
              )}
            </li>
          ))}
        </ul>
      </section>
      <SafetyNote />
    </div>
  );
}
