import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { can, getActor } from '@/lib/server/auth/actor';
import { getDb } from '@/lib/server/db';
import { parseId } from '@/lib/server/http/ids';
import { listInstruments } from '@/lib/server/inspections/list-instruments';
import { DockScreen } from './dock-screen';

export const metadata: Metadata = { title: 'Dock inspection' };
export const dynamic = 'force-dynamic';

// The dock screen for scrutineers of this meeting; it keeps working offline once visited.
export default async function DockPage({ params }: { params: Promise<{ eventId: string }> }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  let eventId: string;
  try {
    eventId = parseId((await params).eventId);
  } catch {
    notFound();
  }
  if (!can(actor, 'inspection.record', { eventId })) redirect(can(actor, 'inspection.board', { eventId }) ? `/inspect/${eventId}/board` : '/not-allowed');
  const event = await getDb().models.Event.findByPk(eventId, { attributes: ['id', 'name', 'venue'] });
  if (!event) notFound();
  const instruments = await listInstruments(actor, eventId);
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / {event.name}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Dock inspection</h1>
        <div className="flex flex-wrap gap-2">
          <Link href={`/inspect/${eventId}/board`} className="btn-secondary text-lg">Inspection board</Link>
          <Link href={`/inspect/${eventId}/custody`} className="btn-secondary text-lg">Parts in custody</Link>
          <Link href={`/inspect/${eventId}/instruments`} className="btn-secondary text-lg">Instruments</Link>
        </div>
      </div>
      <DockScreen eventId={eventId} actorId={actor.id} instruments={instruments} />
    </div>
  );
}
