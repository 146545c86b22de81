import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import type { EventStaffRole, EventStatus } from '@/lib/core/constants';

export type MeetingSummary = {
  id: string;
  name: string;
  venue: string;
  startsOn: string;
  endsOn: string;
  /** IANA zone: the meeting's days are days there. */
  timeZone: string;
  status: EventStatus;
  myRoles: EventStaffRole[];
};

/** Meetings where the person holds a staff role, soonest first. */
export async function listMyMeetings(actor: Actor): Promise<MeetingSummary[]> {
  const ids = Object.keys(actor.eventRoles);
  if (ids.length === 0) return [];
  const events = await getDb().models.Event.findAll({ where: { id: { [Op.in]: ids } }, order: [['startsOn', 'ASC']] });
  return events.map((e) => ({
    id: e.id,
    name: e.name,
    venue: e.venue,
    startsOn: e.startsOn,
    endsOn: e.endsOn,
    timeZone: e.timeZone,
    status: e.status,
    myRoles: (actor.eventRoles[e.id] ?? []) as EventStaffRole[],
  }));
}
