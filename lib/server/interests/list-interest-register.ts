import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { queryInterests, type InterestView } from './interest-view';

export type InterestChoice = { boats: { id: string; label: string }[]; entrants: { id: string; label: string }[] };
export type InterestRegister = {
  event: { id: string; name: string; timeZone: string };
  isWholeRegister: boolean; // stewards and the organiser see every official's declarations
  items: InterestView[];
  choices: InterestChoice; // the meeting's boats and entrants, to declare against
};

/**
 * The meeting's register of declared interests. Any official of the meeting sees their own
 * declarations and the meeting's boats and entrants to declare against; the stewards and the
 * organiser see every official's. Nobody else (403).
 */
export async function listInterestRegister(actor: Actor | null, eventId: string): Promise<InterestRegister> {
  assertCan(actor, 'interest.declare', { eventId });
  const isWholeRegister = can(actor, 'interest.view_register', { eventId });
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['id', 'name', 'timeZone'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const [items, entries] = await Promise.all([
    queryInterests(eventId, isWholeRegister ? {} : { officialId: actor.id }),
    sequelize.query<{ boatId: string; boatLabel: string; entrantId: string; entrantName: string }>(
      `select b.id::text as "boatId", '#' || e.race_number || ' ' || b.name || ' (' || c.code || ')' as "boatLabel",
              u.id::text as "entrantId", coalesce(u.name, u.email) as "entrantName"
         from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id join users u on u.id = e.entrant_id
        where e.event_id = :eventId and e.status <> 'cancelled'
        order by e.race_number`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  const boats = new Map<string, string>();
  const entrants = new Map<string, string>();
  for (const e of entries) {
    if (!boats.has(e.boatId)) boats.set(e.boatId, e.boatLabel);
    entrants.set(e.entrantId, e.entrantName);
  }
  return {
    event: { id: event.id, name: event.name, timeZone: event.timeZone },
    isWholeRegister,
    items,
    choices: {
      boats: [...boats].map(([id, label]) => ({ id, label })),
      entrants: [...entrants].map(([id, label]) => ({ id, label })).sort((a, b) => a.label.localeCompare(b.label)),
    },
  };
}
