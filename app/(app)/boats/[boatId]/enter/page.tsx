import type { Metadata } from 'next';
import Link from '@/components/link';
import { notFound, redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { getMyBoat } from '@/lib/server/boats/get-my-boat';
import { listOpenEvents } from '@/lib/server/entries/list-open-events';
import { EnterForm } from './enter-form';

export const metadata: Metadata = { title: 'Enter a meeting' };
export const dynamic = 'force-dynamic';

export default async function EnterBoatPage({ params }: { params: Promise<{ boatId: string }> }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const { boatId } = await params;
  const [mine, events] = await Promise.all([
    getMyBoat(actor, boatId).catch((err) => {
      if (err instanceof AppError && err.status === 404) notFound();
      throw err;
    }),
    listOpenEvents(actor),
  ]);
  const entered = mine.entries.map((e) => ({
    eventId: e.eventId,
    classId: e.classId,
    classCode: e.classCode,
    raceNumber: e.raceNumber,
  }));
  return (
    <div className="max-w-2xl space-y-5">
      <p>
        <Link href={`/boats/${mine.boat.id}`}>← {mine.boat.name}</Link>
      </p>
      <h1>Enter {mine.boat.name}</h1>
      {events.length === 0 ? (
        <p className="card text-ink-soft">
          No meeting is taking entries just now. Organisers open entries once their class rules are published.
        </p>
      ) : (
        <EnterForm boat={mine.boat} events={events} entered={entered} />
      )}
    </div>
  );
}
