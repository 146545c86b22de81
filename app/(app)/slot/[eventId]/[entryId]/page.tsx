import type { Metadata } from 'next';
import Link from '@/components/link';
import { getEntrySlot } from '@/lib/server/schedule/book-slot';
import { formatTime } from '@/lib/core/format/time';
import { openSlotPage } from './access';
import { BookSlotForm } from './book-slot-form';

export const metadata: Metadata = { title: 'Scrutineering slot' };
export const dynamic = 'force-dynamic';

// An entry's scrutineering slot: when and where the boat is due at the dock, and the slots it may move to.
export default async function SlotPage({ params }: { params: Promise<{ eventId: string; entryId: string }> }) {
  const { eventId: rawEvent, entryId: rawEntry } = await params;
  const access = await openSlotPage(rawEvent, rawEntry);
  const view = await getEntrySlot(access);
  const { event } = view;
  const zone = event.timeZone;
  const others = view.slots.filter((s) => s.id !== view.booking?.slot.id);
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/entries">My entries</Link> / {event.name} / no. {access.entry.raceNumber} / Scrutineering slot
      </nav>
      <h1>Scrutineering slot</h1>
      <p className="text-ink-soft">Times are in {zone}. Arrive at the bay by the start of your slot.</p>
      {view.booking ? (
        <p className="card" data-testid="current-slot">
          Booked: <strong>{view.booking.slot.bay}</strong>, {formatTime(view.booking.slot.startsAt, zone)}
          {view.booking.arrivedAt && ` — checked in ${formatTime(view.booking.arrivedAt, zone)}`}
        </p>
      ) : (
        <p className="card" data-testid="current-slot">
          No slot booked yet.
        </p>
      )}
      {others.length > 0 ? (
        <BookSlotForm
          eventId={access.eventId}
          entryId={access.entry.id}
          hasBooking={Boolean(view.booking)}
          slots={others.map((s) => ({
            id: s.id,
            label: `${s.bay}, ${formatTime(s.startsAt, zone)} — ${s.capacity - s.booked} of ${s.capacity} places left`,
            full: s.booked >= s.capacity,
          }))}
        />
      ) : (
        <p className="text-ink-soft">No other slots are open for this class.</p>
      )}
    </div>
  );
}
