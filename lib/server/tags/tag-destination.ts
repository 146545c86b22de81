import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { lookUpTag } from './tokens';

export type OfficialLink = { label: string; href: string };
export type OfficialMeeting = { eventId: string; eventName: string; raceNumber: number; links: OfficialLink[] };

/**
 * Where a scanned tag takes a signed-in person: the owner to their own boat; a scrutineer or chief
 * scrutineer of a meeting where the boat is entered to that boat's card at the dock (the meeting
 * that is on now or comes next, in the meeting's own zone); anyone else stays on the public card,
 * with links to the meeting's pages an official there (steward, organiser) may open.
 * Only current tags lead anywhere: a replaced or unknown tag shows the public card's warning.
 */
export async function findTagDestination(
  actor: Actor,
  token: string,
): Promise<{ redirectTo: string } | { redirectTo: null; officialAt: OfficialMeeting[] }> {
  const found = await lookUpTag(token);
  if (found.state !== 'current') return { redirectTo: null, officialAt: [] };
  const { models, sequelize } = getDb();
  const boat = await models.Boat.findByPk(found.boatId, { attributes: ['id', 'ownerId'] });
  if (!boat) return { redirectTo: null, officialAt: [] };
  if (boat.ownerId === actor.id) return { redirectTo: `/boats/${boat.id}` };

  const staffEventIds = Object.keys(actor.eventRoles);
  if (staffEventIds.length === 0) return { redirectTo: null, officialAt: [] };
  // Meetings not yet over where this person is staff and the boat is entered (live entries first),
  // soonest first: the one on today comes before the next one.
  const rows = await sequelize.query<{ eventId: string; eventName: string; raceNumber: number }>(
    `select distinct on (ev.starts_on, ev.id) ev.id as "eventId", ev.name as "eventName", e.race_number as "raceNumber"
       from entries e join events ev on ev.id = e.event_id
      where e.boat_id = :boatId and e.event_id in (:eventIds)
        and ev.ends_on >= (now() at time zone ev.time_zone)::date
      order by ev.starts_on, ev.id, (e.status in ('awaiting_payment', 'entered')) desc, e.created_at desc`,
    { replacements: { boatId: boat.id, eventIds: staffEventIds }, type: QueryTypes.SELECT },
  );
  const dock = rows.find((r) => can(actor, 'inspection.record', { eventId: r.eventId }));
  if (dock) return { redirectTo: `/inspect/${dock.eventId}?tag=${encodeURIComponent(token)}` };

  const officialAt = rows
    .map((r) => {
      const links: OfficialLink[] = [];
      if (can(actor, 'entry.view_all', { eventId: r.eventId })) {
        links.push({
          label: `Entries list, race number ${r.raceNumber}`,
          href: `/organise/events/${r.eventId}/entries?q=${r.raceNumber}`,
        });
      }
      if (can(actor, 'inspection.board', { eventId: r.eventId }))
        links.push({ label: 'Inspection board', href: `/inspect/${r.eventId}/board` });
      if (can(actor, 'protest.view_all', { eventId: r.eventId }))
        links.push({ label: 'Protests at this meeting', href: `/stewards/${r.eventId}` });
      return { ...r, links };
    })
    .filter((r) => r.links.length > 0);
  return { redirectTo: null, officialAt };
}
