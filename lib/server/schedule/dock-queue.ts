import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { meetingDayOf } from '@/lib/core/schedule/slot-times';
import { queueStatus, type QueueStatus } from '@/lib/core/schedule/queue-status';
import { CURRENT_BOOKING } from './slot-view';

// The dock's queue for one meeting day (in the meeting's zone): every entry booked into a slot of that
// day, and every walk-in checked in that day, with where each stands. The answer carries the server's
// time, so a phone that loses its connection recomputes "late" from it (lib/core/schedule/queue-status.ts).

export type QueueRow = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  bay: string;
  slotStartsAt: string | null;
  slotEndsAt: string | null;
  graceMinutes: number;
  arrivedAt: string | null;
  walkIn: boolean;
  status: QueueStatus;
};

export type DockQueue = { day: string; timeZone: string; serverTime: string; rows: QueueRow[] };

type Row = Omit<QueueRow, 'slotStartsAt' | 'slotEndsAt' | 'arrivedAt' | 'status'> & {
  slotStartsAt: Date | null;
  slotEndsAt: Date | null;
  arrivedAt: Date | null;
};

/** A real calendar day "yyyy-mm-dd" (not "2027-02-30"), so the database never sees a date it cannot read. */
function isCalendarDay(day: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return false;
  const d = new Date(`${day}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === day;
}

export async function readDockQueue(actor: Actor | null, eventId: string, day?: string | null): Promise<DockQueue> {
  assertCan(actor, 'inspection.board', { eventId });
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['timeZone'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const now = new Date();
  if (day && !isCalendarDay(day)) throw fieldError('day', 'Give the day as yyyy-mm-dd.');
  const theDay = day || meetingDayOf(now, event.timeZone);
  const rows = await sequelize.query<Row>(
    `select e.id as "entryId", e.race_number as "raceNumber", bo.name as "boatName", c.code as "classCode",
            s.bay, s.starts_at as "slotStartsAt", s.ends_at as "slotEndsAt", s.grace_minutes as "graceMinutes",
            a.arrived_at as "arrivedAt", false as "walkIn"
       from slot_bookings b join inspection_slots s on s.id = b.slot_id
       join entries e on e.id = b.entry_id join boats bo on bo.id = e.boat_id join race_classes c on c.id = e.class_id
       left join slot_arrivals a on a.booking_id = b.id
      where b.event_id = :eventId and ${CURRENT_BOOKING}
        and (s.starts_at at time zone :zone)::date = :day::date
     union all
     select e.id, e.race_number, bo.name, c.code, a.bay, null, null, 0, a.arrived_at, true
       from slot_arrivals a join entries e on e.id = a.entry_id join boats bo on bo.id = e.boat_id
       join race_classes c on c.id = e.class_id
      where a.event_id = :eventId and a.booking_id is null and a.meeting_day = :day::date
      order by 6 nulls last, 2`,
    { replacements: { eventId, zone: event.timeZone, day: theDay }, type: QueryTypes.SELECT },
  );
  return {
    day: theDay,
    timeZone: event.timeZone,
    serverTime: now.toISOString(),
    rows: rows.map((r) => {
      const arrivedAt = r.arrivedAt ? new Date(r.arrivedAt).toISOString() : null;
      const slotStartsAt = r.slotStartsAt ? new Date(r.slotStartsAt).toISOString() : null;
      return {
        ...r,
        graceMinutes: Number(r.graceMinutes),
        slotStartsAt,
        slotEndsAt: r.slotEndsAt ? new Date(r.slotEndsAt).toISOString() : null,
        arrivedAt,
        status: slotStartsAt
          ? queueStatus({ startsAt: slotStartsAt, graceMinutes: r.graceMinutes, arrivedAt }, now)
          : 'arrived',
      };
    }),
  };
}
