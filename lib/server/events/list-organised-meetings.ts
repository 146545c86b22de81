import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import type { EventStaffRole, EventStatus } from '@/lib/core/constants';

export type OrganisedMeeting = {
  id: string;
  name: string;
  venue: string;
  startsOn: string;
  status: EventStatus;
  staff: { userId: string; name: string | null; email: string; role: EventStaffRole; isAddressProven: boolean }[];
  pendingInvitations: { email: string; role: EventStaffRole; expiresAt: string }[];
};

/** Meetings the person organises, with their staff; the organiser check is part of the query. */
export async function listOrganisedMeetings(actor: Actor): Promise<OrganisedMeeting[]> {
  const { sequelize } = getDb();
  const [events] = await sequelize.query(
    `select e.id, e.name, e.venue, e.starts_on as "startsOn", e.status
       from events e join event_staff s on s.event_id = e.id and s.user_id = :uid and s.role = 'organiser'
      order by e.starts_on`,
    { replacements: { uid: actor.id } },
  );
  const list = events as Omit<OrganisedMeeting, 'staff' | 'pendingInvitations'>[];
  if (list.length === 0) return [];
  const ids = list.map((e) => e.id);
  const [staff] = await sequelize.query(
    `select s.event_id as "eventId", u.id as "userId", u.name, u.email, s.role, u.email_verified is not null as "isAddressProven"
       from event_staff s join users u on u.id = s.user_id where s.event_id in (:ids) order by s.role, u.name`,
    { replacements: { ids } },
  );
  const [invites] = await sequelize.query(
    `select event_id as "eventId", email, role, expires_at as "expiresAt" from staff_invitations
      where event_id in (:ids) and accepted_at is null and expires_at > now() order by created_at`,
    { replacements: { ids } },
  );
  return list.map((e) => ({
    ...e,
    staff: (staff as (OrganisedMeeting['staff'][number] & { eventId: string })[])
      .filter((s) => s.eventId === e.id)
      .map(({ eventId: _e, ...s }) => s),
    pendingInvitations: (invites as { eventId: string; email: string; role: EventStaffRole; expiresAt: Date }[])
      .filter((i) => i.eventId === e.id)
      .map((i) => ({ email: i.email, role: i.role, expiresAt: new Date(i.expiresAt).toISOString() })),
  }));
}
