import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor, can } from '@/lib/server/auth/actor';
import { listAppeals } from '@/lib/server/appeals/list-appeals';
import { listAppealablePenalties } from '@/lib/server/appeals/list-appealable-penalties';
import { AppealCaution } from '../appeal-caution';
import { LodgeAppealForm } from '../lodge-appeal-form';

export const metadata: Metadata = { title: 'Appeals' };
export const dynamic = 'force-dynamic';

export default async function AppealsPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const [appeals, appealable] = await Promise.all([listAppeals(actor), listAppealablePenalties(actor)]);
  const isAppealBody = can(actor, 'appeal.hear');
  return (
    <div className="space-y-6">
      <h1>{isAppealBody ? 'Appeals to the appeal body' : 'My appeals'}</h1>
      <AppealCaution />
      {appealable.length > 0 && <LodgeAppealForm penalties={appealable} />}
      {appeals.length === 0 ? (
        <p className="card text-ink-soft">No appeals.</p>
      ) : (
        <ul className="space-y-3" data-testid="appeals-list">
          {appeals.map((a) => (
            <li key={a.id} className="card flex flex-wrap items-start justify-between gap-2" data-appeal-id={a.id}>
              <div>
                <Link href={`/appeals/${a.id}`} className="text-lg font-bold">
                  #{a.raceNumber} {a.boatName}: {a.penaltyCode} {a.penaltyLabel}
                </Link>
                <p className="text-ink-soft">
                  {a.eventName} · by {a.lodgedByName} · {a.createdAtLabel}
                  {a.hearingAtLabel && ` · hearing ${a.hearingAtLabel}`}
                </p>
              </div>
              <span className="font-bold">{a.statusLabel}</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
