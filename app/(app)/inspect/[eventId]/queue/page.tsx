import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { openQueue } from '../access';
import { SafetyNote } from '@/components/safety-note';
import { QueueScreen } from './queue-screen';

export const metadata: Metadata = { title: 'Dock queue' };
export const dynamic = 'force-dynamic';

// Who is due at the dock today, who has arrived, who is late; walk-ins. Works on a phone with a poor signal.
export default async function QueuePage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openQueue(params);
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}/board`}>{event.name}</Link> / Dock queue
      </nav>
      <h1>Dock queue</h1>
      <QueueScreen eventId={eventId} actorId={actor.id} canCheckIn={can(actor, 'inspection.record', { eventId })} />
      <SafetyNote />
    </div>
  );
}
