import type { Metadata } from 'next';
import Link from '@/components/link';
import { Suspense } from 'react';
import { can } from '@/lib/server/auth/actor';
import { openBoard } from '../access';
import { BoardView } from './board-view';
import { CrewBoardPanel } from '@/components/crew-board-panel';

export const metadata: Metadata = { title: 'Inspection board' };
export const dynamic = 'force-dynamic';

// The chief scrutineer's and organiser's view of the whole meeting's inspections, refreshing itself.
export default async function BoardPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openBoard(params);
  const canRecord = can(actor, 'inspection.record', { eventId });
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / {event.name} / Board
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Inspection board</h1>
        <div className="flex flex-wrap gap-2">
          {canRecord && (
            <Link href={`/inspect/${eventId}`} className="btn-secondary text-lg">
              Dock screen
            </Link>
          )}
          {can(actor, 'custody.view', { eventId }) && (
            <Link href={`/inspect/${eventId}/custody`} className="btn-secondary text-lg">
              Parts in custody
            </Link>
          )}
          {can(actor, 'start_list.view', { eventId }) && (
            <Link href={`/inspect/${eventId}/start-list`} className="btn-secondary text-lg">
              Start list
            </Link>
          )}
          <Link href={`/inspect/${eventId}/instruments`} className="btn-secondary text-lg">
            Instruments
          </Link>
          <Link href={`/inspect/${eventId}/seals`} className="btn-secondary text-lg">
            Seals
          </Link>
          <Link href={`/inspect/${eventId}/queue`} className="btn-secondary text-lg">
            Dock queue
          </Link>
          <Link href={`/inspect/${eventId}/slots`} className="btn-secondary text-lg">
            Slots
          </Link>
          {can(actor, 'incident.view', { eventId }) && (
            <Link href={`/inspect/${eventId}/incidents`} className="btn-secondary text-lg">
              Incidents
            </Link>
          )}
          {can(actor, 'technical_report.file', { eventId }) && (
            <Link href={`/inspect/${eventId}/reports`} className="btn-secondary text-lg">
              Report to the stewards
            </Link>
          )}
        </div>
      </div>
      <Suspense fallback={<p>Loading the board…</p>}>
        <BoardView
          eventId={eventId}
          canAssign={can(actor, 'inspection.assign_reinspection', { eventId })}
          canRecord={canRecord}
          canOpenLogbook={can(actor, 'entry.view_all', { eventId })}
        />
      </Suspense>
      <Suspense fallback={<p>Loading the crew and gear…</p>}>
        <CrewBoardPanel actor={actor} eventId={eventId} />
      </Suspense>
    </div>
  );
}
