import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { listMyProtests } from '@/lib/server/protests/list-my-protests';
import { listProtestableEntries } from '@/lib/server/protests/list-protestable-entries';

import { DecisionCaution, ProtestStatusBadge } from '../protest-badges';
import { LodgeProtestForm } from '../lodge-protest-form';

export const metadata: Metadata = { title: 'My protests' };
export const dynamic = 'force-dynamic';

export default async function MyProtestsPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const [protests, events] = await Promise.all([listMyProtests(actor), listProtestableEntries(actor)]);
  return (
    <div className="space-y-6">
      <h1>My protests</h1>
      <DecisionCaution />
      {protests.length === 0 ? (
        <p className="card text-ink-soft">You have no protests, and none has been lodged against your boats.</p>
      ) : (
        <ul className="space-y-3" data-testid="my-protests">
          {protests.map((p) => (
            <li key={p.id} className="card flex flex-wrap items-start justify-between gap-2" data-protest-id={p.id}>
              <div>
                <Link href={`/protests/${p.id}`} className="text-lg font-bold">
                  {p.lodgedById === actor.id ? `Against ${p.targetLabel}` : `Against your boat ${p.targetLabel}`}
                </Link>
                <p className="text-ink-soft">
                  {p.eventName} · {p.ruleReference}
                </p>
              </div>
              <ProtestStatusBadge status={p.status} />
            </li>
          ))}
        </ul>
      )}
      {events.length > 0 ? (
        <LodgeProtestForm events={events} />
      ) : (
        <p className="card text-ink-soft">
          You can lodge a protest at a meeting where you have a confirmed entry, once provisional results are published
          there.
        </p>
      )}
    </div>
  );
}
