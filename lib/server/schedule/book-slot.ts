import 'server-only';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { BookSlotInput } from '@/lib/core/inputs/schedule';
import {
  CURRENT_BOOKING,
  LIVE_ENTRY_STATUSES,
  readEntryBooking,
  readSlots,
  type EntryBookingView,
  type SlotView,
} from './slot-view';

/** Who may book for an entry, decided before any body is read: its entrant, or the chief scrutineer. */
export type EntryBookingAccess = {
  actor: Actor;
  eventId: string;
  entry: { id: string; classId: string; raceNumber: number };
  /** The chief scrutineer assigning: may use a slot that has started but not ended. */
  isAssigning: boolean;
};

export async function openEntryBooking(
  actor: Actor | null,
  eventId: string,
  entryId: string,
): Promise<EntryBookingAccess> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const isAssigning = can(actor, 'schedule.manage', { eventId });
  const entry = await getDb().models.Entry.findOne({
    where: { id: entryId, eventId, status: [...LIVE_ENTRY_STATUSES] },
    attributes: ['id', 'classId', 'raceNumber', 'entrantId'],
  });
  // Someone else's entry reads as a missing one: nobody learns which entries exist.
  if (!entry || (!isAssigning && entry.entrantId !== actor.id))
    throw new AppError('not_found', 404, 'No such entry at this meeting.');
  return {
    actor,
    eventId,
    entry: { id: entry.id, classId: entry.classId, raceNumber: entry.raceNumber },
    isAssigning,
  };
}

export type EntrySlotView = {
  event: { name: string; timeZone: string };
  booking: EntryBookingView;
  slots: SlotView[];
};

/** The entry's booking and the slots of its class it could book now (not started; not ended when assigning). */
export async function getEntrySlot(access: EntryBookingAccess): Promise<EntrySlotView> {
  const [event, booking, slots] = await Promise.all([
    getDb().models.Event.findByPk(access.eventId, { attributes: ['name', 'timeZone'] }),
    readEntryBooking(access.eventId, access.entry.id),
    readSlots(access.eventId, { classId: access.entry.classId, notEnded: true }),
  ]);
  const now = Date.now();
  return {
    event: { name: event?.name ?? '', timeZone: event?.timeZone ?? 'UTC' },
    booking,
    slots: slots.filter((s) => access.isAssigning || new Date(s.startsAt).getTime() > now),
  };
}

/**
 * Books the entry into a slot, or moves its booking (a new row superseding the current one). The slot's
 * row is locked first and its places counted after the lock, in a statement of their own (READ COMMITTED
 * gives each statement a fresh snapshot): of two people taking the last place at once, the second waits,
 * then finds the slot full. Two moves of one entry at once: the unique index on supersedes_id lets one in.
 */
export async function bookSlot(access: EntryBookingAccess, raw: unknown): Promise<EntryBookingView> {
  const input = BookSlotInput.parse(raw);
  const { sequelize } = getDb();
  const { eventId, entry, actor } = access;
  try {
    return await sequelize.transaction(async (transaction) => {
      const [slot] = await sequelize.query<{
        id: string;
        classId: string;
        capacity: number;
        started: boolean;
        ended: boolean;
      }>(
        `select id, class_id as "classId", capacity, starts_at <= now() as started, ends_at <= now() as ended
           from inspection_slots where id = :slotId and event_id = :eventId for update`,
        { replacements: { slotId: input.slotId, eventId }, type: QueryTypes.SELECT, transaction },
      );
      if (!slot) throw fieldError('slotId', 'Choose a slot of this meeting.');
      if (slot.classId !== entry.classId) throw fieldError('slotId', "Choose a slot for the entry's class.");
      if (slot.ended || (slot.started && !access.isAssigning))
        throw fieldError('slotId', 'That slot has already started: choose a later one.');
      const current = await readEntryBooking(eventId, entry.id, transaction);
      if (current?.slot.id === slot.id) return current; // already there: nothing to change
      const [row] = await sequelize.query<{ id: string }>(
        `insert into slot_bookings (event_id, slot_id, entry_id, booked_by_id, supersedes_id)
         select :eventId, :slotId, :entryId, :actorId, :supersedesId
          where (select count(*) from slot_bookings b where b.slot_id = :slotId and ${CURRENT_BOOKING}) < :capacity
         returning id`,
        {
          replacements: {
            eventId,
            slotId: slot.id,
            entryId: entry.id,
            actorId: actor.id,
            supersedesId: current?.bookingId ?? null,
            capacity: slot.capacity,
          },
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      if (!row)
        throw new AppError('slot_full', 409, 'That slot is full: choose another.', [
          { field: 'slotId', message: 'That slot is full: choose another.' },
        ]);
      return readEntryBooking(eventId, entry.id, transaction);
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError('booking_changed', 409, "The entry's booking changed a moment ago: look again and choose.");
    throw err;
  }
}
