import type { Metadata } from 'next';
import Link from '@/components/link';
import { format, parseISO } from 'date-fns';
import { getActor } from '@/lib/server/auth/actor';
import { listMyBoats } from '@/lib/server/boats/list-my-boats';
import { listMyMeetings } from '@/lib/server/events/list-my-meetings';
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
  const [meetings, boats] = await Promise.all([listMyMeetings(actor), listMyBoats(actor)]);
  const isStaff = meetings.length > 0;
  const staff = (
    <section className="space-y-3" aria-labelledby="staff-at" key="staff">
      <h2 id="staff-at">Meetings where you are on the staff</h2>
      {!isStaff ? (
        <p className="text-ink-soft">None yet. Organisers invite scrutineers and stewards to a meeting by e-mail.</p>
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
                  <span key={r} className="rounded-full bg-tide-100 px-3 py-1 text-sm font-bold text-tide-700">
                    {ROLE_LABEL[r]}
                  </span>
                ))}
              </p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
  const racing = (
    <section className="space-y-3" aria-labelledby="racing" key="racing" data-testid="home-racing">
      <h2 id="racing">Racing your boat</h2>
      {boats.length === 0 && isStaff ? (
        <p>
          Racing a boat as well? <Link href="/boats/new">Register it</Link> to get its tag and enter meetings.
        </p>
      ) : boats.length === 0 ? (
        <div className="card space-y-3" data-testid="first-step">
          <p className="text-lg font-bold">Your first step: register your boat.</p>
          <p>
            Give its name, nozzle, engine power and weight as you declare them. You then get the boat&apos;s QR tag for
            the scrutineers, can check your figures against a class&apos;s rules, and enter a meeting that is taking
            entries.
          </p>
          <Link href="/boats/new" className="btn-primary">
            Register a boat
          </Link>
        </div>
      ) : (
        <div className="card flex flex-wrap items-center justify-between gap-3">
          <p>
            {boats.length === 1 ? (
              <>
                Your boat: <strong>{boats[0].name}</strong>.
              </>
            ) : (
              <>You have {boats.length} boats registered.</>
            )}
          </p>
          <p className="flex flex-wrap gap-2">
            <Link href="/boats" className="btn-secondary">
              My boats
            </Link>
            <Link href="/entries" className="btn-secondary">
              My entries
            </Link>
          </p>
        </div>
      )}
    </section>
  );
  return (
    <div className="space-y-6">
      <h1 data-testid="home-greeting">Hello, {actor.name ?? actor.email}</h1>
      {!actor.name && (
        <p className="text-ink-soft">
          Officials and stewards see you by name: <Link href="/account">add your name in My account</Link>.
        </p>
      )}
      {isStaff ? [staff, racing] : [racing, staff]}
    </div>
  );
}
