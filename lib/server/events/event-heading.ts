import 'server-only';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { Actor } from '@/lib/server/auth/actor';

export type EventHeading = { id: string; name: string; venue: string; timeZone: string; currency: string };

/**
 * What an official's page of a meeting shows at its top: name, venue, zone and currency. Only for
 * someone on the meeting's staff (the page has already asked its own permission); null when there
 * is no such meeting.
 */
export async function getEventHeading(actor: Actor, eventId: string): Promise<EventHeading | null> {
  if (!actor.eventRoles[eventId]?.length) throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  const event = await getDb().models.Event.findByPk(eventId, {
    attributes: ['id', 'name', 'venue', 'timeZone', 'currency'],
  });
  return (
    event && { id: event.id, name: event.name, venue: event.venue, timeZone: event.timeZone, currency: event.currency }
  );
}

/** A meeting's time zone, for its public pages (published reports); UTC when the meeting is gone. */
export async function getEventTimeZone(eventId: string): Promise<string> {
  return (await getDb().models.Event.findByPk(eventId, { attributes: ['timeZone'] }))?.timeZone ?? 'UTC';
}
