import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { listStewardMeetings } from '@/lib/server/protests/list-steward-meetings';
import { listOfficialMeetings } from '@/lib/server/interests/list-official-meetings';
import { formatCalendarDate } from '@/lib/core/format/time';

export const metadata: Metadata = { title: 'Stewards' };
export const dynamic = 'force-dynamic';

// The meetings where the person sees protests (stewards and organisers), with their desks.
export default async function StewardsPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const [events, officiating] = await Promise.all([listStewardMeetings(actor), listOfficialMeetings(actor)]);
  return (
    <div className="space-y-6">
      <h1>Stewards</h1>
      {events.length === 0 ? (
        <p className="card">You are not a steward or organiser at any meeting.</p>
      ) : (
        <ul className="space-y-3">
          {events.map((e) => (
            <li key={e.id} className="card flex flex-wrap items-center justify-between gap-3" data-event-id={e.id}>
              <div>
                <h2 className="text-xl">{e.name}</h2>
                <p className="text-ink-soft">
                  {e.venue} · {formatCalendarDate(e.startsOn)}
                </p>
              </div>
              <div className="flex flex-wrap gap-2">
                <Link href={`/stewards/${e.id}`} className="btn-primary">
                  Protests
                </Link>
                <Link href={`/stewards/${e.id}/audit`} className="btn-secondary">
                  Audit trail
                </Link>
                <Link href={`/stewards/${e.id}/interests`} className="btn-secondary">
                  Declared interests
                </Link>
                {e.canPublishResults && (
                  <Link href={`/organise/events/${e.id}/results`} className="btn-secondary">
                    Provisional results
                  </Link>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
      {officiating.length > 0 && (
        <section aria-labelledby="officiating" className="space-y-3">
          <h2 id="officiating">Meetings where you officiate</h2>
          <p className="text-ink-soft">Declare any interest you have in a boat, an entrant or a team there.</p>
          <ul className="space-y-3">
            {officiating.map((e) => (
              <li key={e.id} className="card flex flex-wrap items-center justify-between gap-3" data-event-id={e.id}>
                <div>
                  <h3 className="text-xl">{e.name}</h3>
                  <p className="text-ink-soft">
                    {e.venue} · {formatCalendarDate(e.startsOn)}
                  </p>
                </div>
                <Link href={`/stewards/${e.id}/interests`} className="btn-secondary">
                  Declared interests
                </Link>
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
