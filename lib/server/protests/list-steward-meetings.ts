import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';

export type StewardMeeting = { id: string; name: string; venue: string; startsOn: string; canPublishResults: boolean };

/** Meetings where the person sees all protests (stewards and organisers), newest first. */
export async function listStewardMeetings(actor: Actor | null): Promise<StewardMeeting[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const ids = Object.keys(actor.eventRoles).filter((eventId) => can(actor, 'protest.view_all', { eventId }));
  if (ids.length === 0) return [];
  const events = await getDb().models.Event.findAll({ where: { id: { [Op.in]: ids } }, order: [['startsOn', 'DESC']] });
  return events.map((e) => ({
    id: e.id,
    name: e.name,
    venue: e.venue,
    startsOn: e.startsOn,
    canPublishResults: can(actor, 'results.publish', { eventId: e.id }),
  }));
}
