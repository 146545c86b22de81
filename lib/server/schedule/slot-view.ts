import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

// Slots and bookings as screens and the API see them (plain objects), and the queries that read them.
// The current booking of an entry is the row nothing supersedes (slot_bookings is append-only).

export const CURRENT_BOOKING = `not exists (select 1 from slot_bookings x where x.supersedes_id = b.id)`;
export const LIVE_ENTRY_STATUSES = ['awaiting_payment', 'entered'] as const;

export type SlotView = {
  id: string;
  classId: string;
  classCode: string;
  bay: string;
  startsAt: string;
  endsAt: string;
  capacity: number;
  graceMinutes: number;
  booked: number;
};

export type SlotWithBookingsView = SlotView & {
  bookings: { bookingId: string; entryId: string; raceNumber: number; boatName: string; arrivedAt: string | null }[];
};

type SlotRow = Omit<SlotView, 'startsAt' | 'endsAt' | 'booked'> & { startsAt: Date; endsAt: Date; booked: string };

const SLOT_COLUMNS = `s.id, s.class_id as "classId", c.code as "classCode", s.bay, s.starts_at as "startsAt", s.ends_at as "endsAt",
  s.capacity, s.grace_minutes as "graceMinutes",
  (select count(*) from slot_bookings b where b.slot_id = s.id and ${CURRENT_BOOKING}) as booked`;

const toView = (r: SlotRow): SlotView => ({
  ...r,
  startsAt: new Date(r.startsAt).toISOString(),
  endsAt: new Date(r.endsAt).toISOString(),
  booked: Number(r.booked),
});

/** Slots of a meeting (optionally of one class, optionally only those that have not ended), by start. */
export async function readSlots(
  eventId: string,
  opts: { classId?: string; notEnded?: boolean; transaction?: Transaction } = {},
): Promise<SlotView[]> {
  const rows = await getDb().sequelize.query<SlotRow>(
    `select ${SLOT_COLUMNS}
       from inspection_slots s join race_classes c on c.id = s.class_id
      where s.event_id = :eventId
        ${opts.classId ? 'and s.class_id = :classId' : ''}
        ${opts.notEnded ? 'and s.ends_at > now()' : ''}
      order by s.starts_at, s.bay, c.code`,
    {
      replacements: { eventId, classId: opts.classId ?? null },
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    },
  );
  return rows.map(toView);
}

/** Every slot of a meeting with the entries currently booked into it (the chief scrutineer's view). */
export async function readSlotsWithBookings(eventId: string): Promise<SlotWithBookingsView[]> {
  const { sequelize } = getDb();
  const [slots, bookings] = await Promise.all([
    readSlots(eventId),
    sequelize.query<{
      slotId: string;
      bookingId: string;
      entryId: string;
      raceNumber: number;
      boatName: string;
      arrivedAt: Date | null;
    }>(
      `select b.slot_id as "slotId", b.id as "bookingId", b.entry_id as "entryId", e.race_number as "raceNumber",
              bo.name as "boatName", a.arrived_at as "arrivedAt"
         from slot_bookings b join entries e on e.id = b.entry_id join boats bo on bo.id = e.boat_id
         left join slot_arrivals a on a.booking_id = b.id
        where b.event_id = :eventId and ${CURRENT_BOOKING}
        order by e.race_number`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  return slots.map((s) => ({
    ...s,
    bookings: bookings
      .filter((b) => b.slotId === s.id)
      .map(({ slotId: _slot, arrivedAt, ...b }) => ({
        ...b,
        arrivedAt: arrivedAt ? new Date(arrivedAt).toISOString() : null,
      })),
  }));
}

export type EntryBookingView = {
  bookingId: string;
  slot: SlotView;
  arrivedAt: string | null;
  bookedAt: string;
} | null;

/** The entry's current booking with its slot, if any. */
export async function readEntryBooking(
  eventId: string,
  entryId: string,
  transaction?: Transaction,
): Promise<EntryBookingView> {
  const [row] = await getDb().sequelize.query<SlotRow & { bookingId: string; arrivedAt: Date | null; bookedAt: Date }>(
    `select ${SLOT_COLUMNS}, b.id as "bookingId", b.created_at as "bookedAt", a.arrived_at as "arrivedAt"
       from slot_bookings b join inspection_slots s on s.id = b.slot_id join race_classes c on c.id = s.class_id
       left join slot_arrivals a on a.booking_id = b.id
      where b.event_id = :eventId and b.entry_id = :entryId and ${CURRENT_BOOKING}`,
    { replacements: { eventId, entryId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) return null;
  const { bookingId, arrivedAt, bookedAt, ...slot } = row;
  return {
    bookingId,
    slot: toView(slot),
    arrivedAt: arrivedAt ? new Date(arrivedAt).toISOString() : null,
    bookedAt: new Date(bookedAt).toISOString(),
  };
}
