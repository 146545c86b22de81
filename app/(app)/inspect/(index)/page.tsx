import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { format, parseISO } from 'date-fns';
import { can, getActor } from '@/lib/server/auth/actor';
import { listMyMeetings } from '@/lib/server/events/list-my-meetings';

export const metadata: Metadata = { title: 'Inspect' };
export const dynamic = 'force-dynamic';

// Meetings where the person inspects (or watches the inspection board), soonest first.
export default async function InspectPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const meetings = (await listMyMeetings(actor)).filter(
    (m) => can(actor, 'inspection.record', { eventId: m.id }) || can(actor, 'inspection.board', { eventId: m.id }),
  );
  return (
    <div className="space-y-6 text-lg">
      <h1>Inspect</h1>
      {meetings.length === 0 ? (
        <p>You are not a scrutineer at any meeting. The organiser adds scrutineers to a meeting’s staff.</p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" data-testid="inspect-meetings">
          {meetings.map((m) => (
            <li key={m.id} className="card space-y-3" data-event-id={m.id}>
              <h2 className="text-xl">{m.name}</h2>
              <p className="text-ink-soft">
                {m.venue} · {format(parseISO(m.startsOn), 'd MMM yyyy')}–{format(parseISO(m.endsOn), 'd MMM yyyy')}
              </p>
              <div className="flex flex-wrap gap-3">
                {can(actor, 'inspection.record', { eventId: m.id }) && (
                  <Link href={`/inspect/${m.id}`} className="btn-primary text-lg">
                    Dock screen
                  </Link>
                )}
                {can(actor, 'inspection.board', { eventId: m.id }) && (
                  <Link href={`/inspect/${m.id}/board`} className="btn-secondary text-lg">
                    Inspection board
                  </Link>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
