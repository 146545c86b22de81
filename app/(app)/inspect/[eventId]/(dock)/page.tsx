import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { listInstruments } from '@/lib/server/inspections/list-instruments';
import { openDock } from '../access';
import { DockScreen } from '../dock-screen';

export const metadata: Metadata = { title: 'Dock inspection' };
export const dynamic = 'force-dynamic';

// The dock screen for scrutineers of this meeting; it keeps working offline once visited.
export default async function DockPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<{ race?: string; tag?: string }>;
}) {
  const { actor, eventId, event } = await openDock(params);
  const { race, tag } = await searchParams;
  const instruments = await listInstruments(actor, eventId);
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / {event.name}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Dock inspection</h1>
        <div className="flex flex-wrap gap-2">
          <Link href={`/inspect/${eventId}/board`} className="btn-secondary text-lg">
            Inspection board
          </Link>
          <Link href={`/inspect/${eventId}/custody`} className="btn-secondary text-lg">
            Parts in custody
          </Link>
          <Link href={`/inspect/${eventId}/instruments`} className="btn-secondary text-lg">
            Instruments
          </Link>
          <Link href={`/inspect/${eventId}/seals`} className="btn-secondary text-lg">
            Seals
          </Link>
        </div>
      </div>
      <DockScreen
        eventId={eventId}
        actorId={actor.id}
        instruments={instruments}
        canOpenLogbook={can(actor, 'entry.view_all', { eventId })}
        opensFromLink={Boolean(race || tag)}
      />
    </div>
  );
}
