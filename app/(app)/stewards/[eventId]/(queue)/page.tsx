import type { Metadata } from 'next';
import Link from '@/components/link';
import { openQueue } from '../access';
import { listStewardQueue } from '@/lib/server/protests/list-steward-queue';
import { formatMoney } from '@/lib/core/inputs/entries';
import { DecisionCaution, ProtestStatusBadge } from '../../../protests/protest-badges';

export const metadata: Metadata = { title: 'Protest queue' };
export const dynamic = 'force-dynamic';

export default async function StewardQueuePage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId } = await openQueue(params);
  const q = await listStewardQueue(actor, eventId);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/stewards">Stewards</Link> / {q.event.name}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Protests at {q.event.name}</h1>
        <div className="flex flex-wrap gap-2">
          <Link href={`/inspect/${eventId}/custody`} className="btn-secondary">
            Parts in custody
          </Link>
          <Link href={`/stewards/${eventId}/penalties`} className="btn-secondary">
            Penalties
          </Link>
          <Link href={`/stewards/${eventId}/audit`} className="btn-secondary">
            Audit trail
          </Link>
          <Link href={`/stewards/${eventId}/interests`} className="btn-secondary">
            Declared interests
          </Link>
        </div>
      </div>
      <p className="text-ink-soft">
        Window {q.event.protestWindowMinutes} minutes after the results concerned · notice of appeal{' '}
        {q.event.appealNoticeMinutes} minutes after a decision · fee{' '}
        {q.event.protestFeeMinor > 0 ? formatMoney(q.event.protestFeeMinor, q.event.currency) : 'none'} · times in{' '}
        {q.event.timeZone}
      </p>
      {q.total === 0 && <p className="card">No protests at this meeting.</p>}
      {q.groups.map((g) => (
        <section
          key={g.status}
          aria-labelledby={`group-${g.status}`}
          className="space-y-2"
          data-testid={`queue-${g.status}`}
        >
          <h2 id={`group-${g.status}`}>
            {g.label} ({g.items.length})
          </h2>
          <ul className="space-y-2">
            {g.items.map((p) => (
              <li key={p.id} className="card flex flex-wrap items-start justify-between gap-2" data-protest-id={p.id}>
                <div>
                  <Link href={`/stewards/${eventId}/protests/${p.id}`} className="text-lg font-bold">
                    {p.targetLabel}: {p.ruleReference}
                  </Link>
                  <p className="text-sm text-ink-soft">
                    by {p.lodgedByName} · submitted {p.lodgedAtLabel}
                    {p.paidAt && p.paidAt > p.windowDeadline ? ' · fee paid after the window closed' : ''}
                  </p>
                </div>
                <ProtestStatusBadge status={p.status} />
              </li>
            ))}
          </ul>
        </section>
      ))}
      <DecisionCaution />
    </div>
  );
}
