import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';

// Who may read a boat's logbook: its owner, and officials with entry.view_all at a meeting the boat
// is entered in (the rule boat documents follow). Anyone else gets the 404 of a missing boat.

export type LogbookAccess = {
  actor: Actor;
  boat: { id: string; name: string; hullNumber: string };
  isOwner: boolean;
  /** Every meeting the boat was ever entered in. */
  eventIds: string[];
  /** Meetings among those where this person may add a note (boat.log_note). */
  noteEventIds: string[];
};

export const noSuchBoat = () => new AppError('not_found', 404, 'No such boat.');

type Row = { id: string; name: string; hullNumber: string; ownerId: string; eventIds: string[] };

/** The boat and the meetings it was entered in (null when the id names no boat). */
async function findBoatWithMeetings(boatId: string): Promise<Row | null> {
  const [row] = await getDb().sequelize.query<Row>(
    `select b.id, b.name, b.hull_number as "hullNumber", b.owner_id as "ownerId",
            coalesce((select json_agg(distinct e.event_id) from entries e where e.boat_id = b.id), '[]') as "eventIds"
       from boats b where b.id = :boatId`,
    { replacements: { boatId }, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

/** Opens the logbook for reading: 401 without a session, 404 for a missing boat and for anyone not allowed. */
export async function openLogbook(actor: Actor | null, rawBoatId: string): Promise<LogbookAccess> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  let boatId: string;
  try {
    boatId = parseId(rawBoatId, 'boat');
  } catch {
    throw noSuchBoat();
  }
  const row = await findBoatWithMeetings(boatId);
  if (!row) throw noSuchBoat();
  const isOwner = row.ownerId === actor.id;
  const isOfficial = row.eventIds.some((eventId) => can(actor, 'entry.view_all', { eventId }));
  if (!isOwner && !isOfficial) throw noSuchBoat();
  return {
    actor,
    boat: { id: row.id, name: row.name, hullNumber: row.hullNumber },
    isOwner,
    eventIds: row.eventIds,
    noteEventIds: row.eventIds.filter((eventId) => can(actor, 'boat.log_note', { eventId })),
  };
}

/**
 * For adding a note: 401 without a session; 403 for anyone who holds boat.log_note at no meeting
 * this boat is entered in (the owner included), asked before any body is read. A missing boat
 * answers the same 403, so the answer tells nobody whether the id names a boat.
 */
export async function openLogbookForNote(
  actor: Actor | null,
  rawBoatId: string,
): Promise<{ actor: Actor; boatId: string; noteEventIds: string[] }> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const boatId = parseId(rawBoatId, 'boat');
  const row = await findBoatWithMeetings(boatId);
  const allowed = (row?.eventIds ?? []).filter((eventId) => can(actor, 'boat.log_note', { eventId }));
  if (!row || allowed.length === 0)
    throw new AppError(
      'forbidden',
      403,
      'Only the chief scrutineer or a steward of a meeting this boat is entered in can add a note to its logbook.',
    );
  // An official's note is a record others rely on: not written by the boat's owner or an entrant of
  // it (as an inspection of one's own boat is refused), nor at a meeting where the official declared
  // an interest in the boat or in its owner or entrants that still stands.
  const [ties] = await getDb().sequelize.query<{ party: boolean; conflicted: string[] }>(
    `select (b.owner_id = :actorId or exists (select 1 from entries e where e.boat_id = b.id and e.entrant_id = :actorId)) as party,
            coalesce((select array_agg(distinct i.event_id::text) from official_interests i
                       left join official_interest_withdrawals w on w.interest_id = i.id
                      where i.official_id = :actorId and w.id is null
                        and ((i.subject_kind = 'boat' and i.boat_id = b.id)
                          or (i.subject_kind = 'entrant' and (i.entrant_id = b.owner_id
                              or i.entrant_id in (select e.entrant_id from entries e where e.boat_id = b.id))))), '{}') as conflicted
       from boats b where b.id = :boatId`,
    { replacements: { actorId: actor.id, boatId: row.id }, type: QueryTypes.SELECT },
  );
  if (ties?.party)
    throw new AppError(
      'own_boat',
      403,
      'You cannot write an official note on a boat you own or entered: ask another official.',
    );
  const noteEventIds = allowed.filter((eventId) => !(ties?.conflicted ?? []).includes(eventId));
  if (noteEventIds.length === 0)
    throw new AppError(
      'conflict_of_interest',
      403,
      'You declared an interest in this boat or its people at this meeting: ask another official to write the note.',
    );
  return { actor, boatId: row.id, noteEventIds };
}
