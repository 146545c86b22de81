import type { Metadata } from 'next';
import { format, parseISO } from 'date-fns';
import { getActor } from '@/lib/auth/actor';
import { listMyMeetings } from '@/lib/events/list-my-meetings';
import { redirect } from 'next/navigation';

export const metadata: Metadata = { title: 'Home' };

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
};

export default async function HomePage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const meetings = await listMyMeetings(actor);
  return (
    <div className="space-y-6">
      <h1>Hello, {actor.name ?? actor.email}</h1>
      <section className="space-y-3" aria-labelledby="staff-at">
        <h2 id="staff-at">Meetings where you are on the staff</h2>
        {meetings.length === 0 ? (
          <p className="text-ink-soft">You have no staff role at any meeting. Organisers invite scrutineers and stewards by e-mail.</p>
        ) : (
          <ul className="grid gap-3 sm:grid-cols-2">
            {meetings.map((m) => (
              <li key={m.id} className="card">
                <h3>{m.name}</h3>
                <p className="text-ink-soft">
                  {m.venue} · {format(parseISO(m.startsOn), 'd MMM yyyy')}–{format(parseISO(m.endsOn), 'd MMM yyyy')}
                </p>
                <p className="mt-2 flex flex-wrap gap-2">
                  {m.myRoles.map((r) => (
                    <span key={r} className="rounded-full bg-tide-100 px-3 py-1 text-sm font-bold text-tide-700">{ROLE_LABEL[r]}</span>
                  ))}
                </p>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
