import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { lookUpTag } from '@/lib/server/tags/tokens';

export type TagDescription =
  | {
      state: 'current';
      boatName: string;
      hullNumber: string;
      upcoming: { eventName: string; venue: string; startsOn: string; className: string; raceNumber: number }[];
    }
  | { state: 'retired'; boatName: string; retiredAt: string }
  | { state: 'unknown' };

/**
 * What a scanned tag shows to anyone (no sign-in): the boat's name and its race numbers at
 * meetings that have not ended. Declarations, owners and documents stay behind sign-in.
 */
export async function describeTag(token: string): Promise<TagDescription> {
  const found = await lookUpTag(token);
  if (found.state === 'unknown') return { state: 'unknown' };
  const { models, sequelize } = getDb();
  const boat = await models.Boat.findByPk(found.boatId, { attributes: ['id', 'name', 'hullNumber'] });
  if (!boat) return { state: 'unknown' };
  if (found.state === 'retired')
    return { state: 'retired', boatName: boat.name, retiredAt: found.retiredAt.toISOString() };
  const upcoming = await sequelize.query<{
    eventName: string;
    venue: string;
    startsOn: string | Date;
    className: string;
    raceNumber: number;
  }>(
    `select ev.name as "eventName", ev.venue, ev.starts_on as "startsOn", c.name as "className", e.race_number as "raceNumber"
       from entries e join events ev on ev.id = e.event_id join race_classes c on c.id = e.class_id
      where e.boat_id = :boatId and e.status in ('awaiting_payment', 'entered') and ev.ends_on >= current_date
      order by ev.starts_on`,
    { replacements: { boatId: boat.id }, type: QueryTypes.SELECT },
  );
  return {
    state: 'current',
    boatName: boat.name,
    hullNumber: boat.hullNumber,
    upcoming: upcoming.map((u) => ({
      ...u,
      startsOn: typeof u.startsOn === 'string' ? u.startsOn : u.startsOn.toISOString().slice(0, 10),
    })),
  };
}
