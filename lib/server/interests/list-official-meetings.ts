import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';

export type OfficialMeeting = { id: string; name: string; venue: string; startsOn: string };

/** Meetings where the person is an official who declares interests but does not see protests (scrutineers), newest first. */
export async function listOfficialMeetings(actor: Actor | null): Promise<OfficialMeeting[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const ids = Object.keys(actor.eventRoles).filter(
    (eventId) => can(actor, 'interest.declare', { eventId }) && !can(actor, 'protest.view_all', { eventId }),
  );
  if (ids.length === 0) return [];
  const events = await getDb().models.Event.findAll({ where: { id: { [Op.in]: ids } }, order: [['startsOn', 'DESC']] });
  return events.map((e) => ({ id: e.id, name: e.name, venue: e.venue, startsOn: e.startsOn }));
}
