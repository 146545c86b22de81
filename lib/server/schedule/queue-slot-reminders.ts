import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { appUrl } from '@/lib/server/config/env';
import { enqueueMail } from '@/lib/server/mail/outbox';
import { formatTime } from '@/lib/core/format/time';
import { SLOT_REMINDER_LEAD_MINUTES } from '@/lib/core/schedule/queue-status';
import { CURRENT_BOOKING, LIVE_ENTRY_STATUSES } from './slot-view';

/**
 * Queues the reminder of every current booking whose slot starts within the lead time, once per booking:
 * the row in slot_reminders (its key is the booking) and the mail are written in one transaction, so two
 * app servers running this at once queue one mail, and a rolled-back run queues none. A booking moved to
 * another slot is a new booking and gets its own reminder; one checked in already gets none.
 * Run by each app server's outbox worker before it sends (lib/server/mail/outbox-worker.ts).
 */
export async function queueSlotReminders(limit = 200): Promise<number> {
  const { sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    const due = await sequelize.query<{
      bookingId: string;
      email: string;
      name: string | null;
      startsAt: Date;
      bay: string;
      eventName: string;
      timeZone: string;
      eventId: string;
      raceNumber: number;
      boatName: string;
      classCode: string;
    }>(
      `with due as (
         select b.id as booking_id from slot_bookings b join inspection_slots s on s.id = b.slot_id
           join entries e on e.id = b.entry_id
          where ${CURRENT_BOOKING}
            and s.starts_at > now() and s.starts_at <= now() + make_interval(mins => :leadMinutes)
            and e.status in (:live)
            and not exists (select 1 from slot_reminders r where r.booking_id = b.id)
            and not exists (select 1 from slot_arrivals a where a.booking_id = b.id)
          limit :limit),
       ins as (insert into slot_reminders (booking_id) select booking_id from due on conflict do nothing returning booking_id)
       select b.id as "bookingId", u.email, u.name, s.starts_at as "startsAt", s.bay, ev.name as "eventName",
              ev.time_zone as "timeZone", ev.id as "eventId", e.race_number as "raceNumber", bo.name as "boatName", c.code as "classCode"
         from ins join slot_bookings b on b.id = ins.booking_id join inspection_slots s on s.id = b.slot_id
         join entries e on e.id = b.entry_id join users u on u.id = e.entrant_id join events ev on ev.id = b.event_id
         join boats bo on bo.id = e.boat_id join race_classes c on c.id = e.class_id`,
      {
        replacements: { leadMinutes: SLOT_REMINDER_LEAD_MINUTES, live: [...LIVE_ENTRY_STATUSES], limit },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (!due.length) return 0;
    await enqueueMail(
      due.map((d) => {
        const when = formatTime(d.startsAt, d.timeZone);
        return {
          kind: 'slot_reminder',
          to: d.email,
          subject: `Scrutineering at ${d.eventName}: no. ${d.raceNumber} at ${d.bay}, ${when}`,
          text: [
            `Hello${d.name ? ` ${d.name}` : ''},`,
            '',
            `${d.boatName} (no. ${d.raceNumber}, ${d.classCode}) is booked for scrutineering at ${d.bay}, ${when}.`,
            'Bring the boat and its crew to the dock on time; a boat that misses its slot is marked late and may have to book again.',
            '',
            `Your entries: ${new URL('/entries', appUrl()).toString()}`,
            '',
            "The officials' decisions and the meeting's rules govern: this reminder is for convenience only.",
          ].join('\n'),
        };
      }),
      transaction,
    );
    return due.length;
  });
}
