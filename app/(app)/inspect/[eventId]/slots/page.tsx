import type { Metadata } from 'next';
import Link from '@/components/link';
import { openSlots } from '../access';
import { loadSlotPlanner } from '@/lib/server/schedule/slot-planner';
import { formatTime } from '@/lib/core/format/time';
import { AssignSlotForm, OpenSlotForm } from './slot-forms';

export const metadata: Metadata = { title: 'Scrutineering slots' };
export const dynamic = 'force-dynamic';

// The meeting's scrutineering schedule: slots per class and bay with who is booked; the chief scrutineer opens
// slots and gives entries one. Entrants book their own from their entries page.
export default async function SlotsPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openSlots(params);
  const planner = await loadSlotPlanner(actor, eventId);
  const open = planner.slots.filter((s) => planner.notEndedIds.includes(s.id));
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}/board`}>{event.name}</Link> /
        Scrutineering slots
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Scrutineering slots</h1>
        <Link href={`/inspect/${eventId}/queue`} className="btn-secondary text-lg">
          Dock queue
        </Link>
      </div>
      <p className="text-ink-soft">
        Times are in {event.timeZone}. A booking that is moved is kept in the record and replaced by the new one.
      </p>
      {planner.canManage && planner.classes.length > 0 && (
        <OpenSlotForm eventId={eventId} timeZone={event.timeZone} classes={planner.classes} />
      )}
      {planner.canManage && planner.entries.length > 0 && open.length > 0 && (
        <AssignSlotForm
          eventId={eventId}
          entries={planner.entries.map((e) => ({
            id: e.id,
            label: `no. ${e.raceNumber} ${e.boatName} (${planner.classes.find((c) => c.id === e.classId)?.code ?? ''})`,
          }))}
          slots={open.map((s) => ({
            id: s.id,
            label: `${s.classCode} · ${s.bay} · ${formatTime(s.startsAt, event.timeZone)} (${s.booked}/${s.capacity})`,
          }))}
        />
      )}
      <section aria-labelledby="slot-list-heading" className="space-y-3">
        <h2 id="slot-list-heading" className="text-xl">
          Slots ({planner.slots.length})
        </h2>
        {planner.slots.length === 0 && <p className="card text-ink-soft">No slots have been opened yet.</p>}
        <ul className="space-y-3" data-testid="slot-list">
          {planner.slots.map((s) => (
            <li key={s.id} className="card space-y-1" data-slot={s.id}>
              <p className="font-bold">
                {s.classCode} · {s.bay} · {formatTime(s.startsAt, event.timeZone)}
              </p>
              <p className="text-base">
                <span className="figure">
                  {s.booked} of {s.capacity}
                </span>{' '}
                booked · {Math.round((new Date(s.endsAt).getTime() - new Date(s.startsAt).getTime()) / 60_000)} min ·
                late after {s.graceMinutes} min
              </p>
              {s.bookings.length > 0 && (
                <ul className="text-base">
                  {s.bookings.map((b) => (
                    <li key={b.bookingId}>
                      no. {b.raceNumber} {b.boatName}
                      {b.arrivedAt ? ` — arrived ${formatTime(b.arrivedAt, event.timeZone)}` : ''}
                    </li>
                  ))}
                </ul>
              )}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
