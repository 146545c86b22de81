import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { RecordArrivalInput } from '@/lib/core/inputs/schedule';
import { meetingDayOf } from '@/lib/core/schedule/slot-times';
import { CURRENT_BOOKING, LIVE_ENTRY_STATUSES } from './slot-view';

export type ArrivalView = {
  id: string;
  entryId: string;
  bookingId: string | null;
  walkIn: boolean;
  arrivedAt: string;
  meetingDay: string;
};

// A phone's clock may be off, and a check-in may wait offline; one from the future or from long ago is a mistake.
const FUTURE_SLACK_MS = 5 * 60_000;
const PAST_LIMIT_MS = 48 * 3_600_000;

/**
 * A boat checked in at the dock: against the entry's current booking, or as a walk-in when it has none
 * for that day. The phone's key makes a retry harmless: the same key answers the stored check-in, and a
 * second check-in of the same booking (or walk-in that day) answers the first one.
 */
export async function recordArrival(actor: Actor | null, eventId: string, raw: unknown): Promise<ArrivalView> {
  assertCan(actor, 'inspection.record', { eventId });
  const input = RecordArrivalInput.parse(raw);
  const arrivedAt = new Date(input.arrivedAt);
  const now = Date.now();
  if (arrivedAt.getTime() > now + FUTURE_SLACK_MS || arrivedAt.getTime() < now - PAST_LIMIT_MS)
    throw fieldError('arrivedAt', 'The arrival time is not plausible: check the phone’s clock.');
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['timeZone', 'startsOn', 'endsOn'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const entry = await models.Entry.findOne({
    where: { id: input.entryId, eventId, status: [...LIVE_ENTRY_STATUSES] },
    attributes: ['id', 'entrantId', 'boatId'],
  });
  if (!entry) throw fieldError('entryId', 'Choose a live entry of this meeting.');
  // Nobody checks in a boat they entered or own (as at the dock's record).
  const boat = await models.Boat.findByPk(entry.boatId, { attributes: ['ownerId'] });
  if (entry.entrantId === actor.id || boat?.ownerId === actor.id)
    throw new AppError('own_boat', 403, 'You entered or own this boat: another official must check it in.');
  const meetingDay = meetingDayOf(arrivedAt, event.timeZone);
  if (meetingDay < event.startsOn || meetingDay > event.endsOn)
    throw fieldError('arrivedAt', `Boats are checked in on the meeting's days (${event.startsOn} to ${event.endsOn}).`);
  // One statement: the booking of that day (if any), the insert, and on any conflict the row already there.
  const [row] = await sequelize.query<{
    id: string;
    entryId: string;
    bookingId: string | null;
    arrivedAt: Date;
    meetingDay: string;
  }>(
    `with booking as (
       select b.id from slot_bookings b join inspection_slots s on s.id = b.slot_id
        where b.event_id = :eventId and b.entry_id = :entryId and ${CURRENT_BOOKING}
          and (s.starts_at at time zone :zone)::date = :day::date),
     ins as (
       insert into slot_arrivals (event_id, entry_id, booking_id, client_key, meeting_day, bay, arrived_at, recorded_by_id)
       values (:eventId, :entryId, (select id from booking), :key, :day::date, :bay, :arrivedAt, :actorId)
       on conflict do nothing
       returning id, entry_id, booking_id, arrived_at, meeting_day)
     select id, entry_id as "entryId", booking_id as "bookingId", arrived_at as "arrivedAt", meeting_day::text as "meetingDay" from ins
     union all
     select a.id, a.entry_id, a.booking_id, a.arrived_at, a.meeting_day::text from slot_arrivals a
      where not exists (select 1 from ins)
        and a.event_id = :eventId
        and (a.client_key = :key
             or (a.entry_id = :entryId and (a.booking_id = (select id from booking)
                 or (a.booking_id is null and (select id from booking) is null and a.meeting_day = :day::date))))
      order by 1 limit 1`,
    {
      replacements: {
        eventId,
        entryId: entry.id,
        zone: event.timeZone,
        day: meetingDay,
        key: input.key,
        bay: input.bay,
        arrivedAt,
        actorId: actor.id,
      },
      type: QueryTypes.SELECT,
    },
  );
  if (!row) throw new AppError('arrival_conflict', 409, 'This check-in could not be stored: reload the queue.');
  if (row.entryId !== entry.id)
    throw new AppError('key_reused', 409, 'This check-in key was already used for another boat.');
  return {
    id: row.id,
    entryId: row.entryId,
    bookingId: row.bookingId,
    walkIn: row.bookingId === null,
    arrivedAt: new Date(row.arrivedAt).toISOString(),
    meetingDay: row.meetingDay,
  };
}
